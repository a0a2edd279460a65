import { apiTestEnv } from './test-env.ts';

// Runs in each test worker before the test file imports the app, so config/env.ts sees the test settings.
Object.assign(process.env, apiTestEnv);
