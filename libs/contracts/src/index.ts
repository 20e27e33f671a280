export * from './lib/roles';
export * from './lib/auth';
export * from './lib/health';
export * from './lib/analyses';
export * from './lib/api-error';
export * from './lib/datasets';
