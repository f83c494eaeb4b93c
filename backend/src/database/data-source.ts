import 'reflect-metadata';
import { DataSource } from 'typeorm';
import { loadAppConfig } from '../config/app.config.js';
import { typeormOptions } from './typeorm-options.js';

/** Used by the TypeORM CLI (migration:generate / migration:run). */
export default new DataSource({ ...typeormOptions(loadAppConfig().database), migrationsRun: false });
