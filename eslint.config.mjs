import nx from '@nx/eslint-plugin';

export default [
  ...nx.configs['flat/base'],
  ...nx.configs['flat/typescript'],
  ...nx.configs['flat/javascript'],
  {
    ignores: ['**/dist', '**/node_modules', '**/.nx', '**/.angular', '**/test-output', 'tmp'],
  },
  {
    files: ['**/*.ts', '**/*.js', '**/*.mjs'],
    rules: {
      // Layering: apps on top, then data-access/ui, then util; the engine depends on nothing of ours,
      // and the console never reaches into the api (both share libs/contracts instead).
      '@nx/enforce-module-boundaries': [
        'error',
        {
          enforceBuildableLibDependency: true,
          allow: ['^.*/eslint(\\.base)?\\.config\\.[cm]?[jt]s$'],
          depConstraints: [
            { sourceTag: 'type:app', onlyDependOnLibsWithTags: ['type:util', 'type:data'] },
            { sourceTag: 'type:e2e', onlyDependOnLibsWithTags: ['type:util'] },
            { sourceTag: 'type:data', onlyDependOnLibsWithTags: ['type:util'] },
            { sourceTag: 'type:util', onlyDependOnLibsWithTags: ['type:util'] },
            { sourceTag: 'scope:engine', onlyDependOnLibsWithTags: [] },
            { sourceTag: 'scope:shared', onlyDependOnLibsWithTags: ['scope:engine', 'scope:shared'] },
            { sourceTag: 'scope:console', onlyDependOnLibsWithTags: ['scope:console', 'scope:shared', 'scope:engine'] },
            { sourceTag: 'scope:api', onlyDependOnLibsWithTags: ['scope:api', 'scope:shared', 'scope:engine', 'scope:db'] },
            { sourceTag: 'scope:db', onlyDependOnLibsWithTags: [] },
          ],
        },
      ],
      '@typescript-eslint/no-non-null-assertion': 'off',
      '@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_', varsIgnorePattern: '^_' }],
    },
  },
];
