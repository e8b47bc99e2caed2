import 'reflect-metadata';
import { DataSource } from 'typeorm';
import { loadAppConfig } from '../config/app-config.js';
import { databaseOptions } from './options.js';

/** The DataSource the typeorm CLI uses (`npm run db:migration:generate`). */
export default new DataSource(databaseOptions(loadAppConfig()));
