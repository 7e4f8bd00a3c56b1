export type { AppDependencies } from './app.js';
export { createApp } from './app.js';
export type { ServerConfig } from './config.js';
export { ConfigError, parseConfig } from './config.js';
export { createDatabase } from './db.js';
export { DEMO_ORGANISATION, DEMO_PASSWORD, DEMO_USERS, loadDemoData } from './demo/load-demo-data.js';
export type { HealthReport } from './services/health-service.js';
export type { HealthStore } from './stores/health-store.js';
export { createKnexHealthStore } from './stores/health-store.js';
