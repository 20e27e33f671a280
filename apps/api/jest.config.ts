export default {
  displayName: 'api',
  preset: '../../jest.preset.js',
  testEnvironment: 'node',
  // Each suite starts an app on a fresh database; a busy 2-core machine needs more than the default 5 s for that.
  testTimeout: 30_000,
  transform: {
    '^.+\\.ts$': ['ts-jest', { tsconfig: '<rootDir>/tsconfig.spec.json' }],
    // marked ships only as an ES module; Node requires it natively, Jest's module system needs it compiled.
    '^.+/node_modules/marked/.+\\.js$': ['ts-jest', { tsconfig: '<rootDir>/tsconfig.esm-packages.json' }],
  },
  transformIgnorePatterns: ['/node_modules/(?!marked/)'],
  moduleFileExtensions: ['ts', 'js'],
  coverageDirectory: '../../coverage/apps/api',
};
