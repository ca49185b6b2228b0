import { vi } from 'vitest';

// The integration project runs with `isolate: false` (vitest.config.mts): a worker process runs
// file after file, its packages (Sequelize, next-auth, the driver) loaded once.
// Each file still starts as if alone: with the environment the worker started with (a test may set
// process.env for its own file), and with fresh project modules, so caches such as getEnv() start
// empty. What a file keeps on globalThis it clears in its own afterAll.
const g = globalThis as { __brinewrightStartEnv?: NodeJS.ProcessEnv };
g.__brinewrightStartEnv ??= { ...process.env };
const start = g.__brinewrightStartEnv;
for (const key of Object.keys(process.env)) if (!(key in start)) delete process.env[key];
Object.assign(process.env, start);
vi.resetModules();
