import 'reflect-metadata';
import { DataSource } from 'typeorm';
import { validateEnv } from '../config/env.schema';
import { dataSourceOptions } from '../database/data-source-options';

// For the typeorm CLI (`typeorm migration:run -d dist/db/data-source.js`), which wants exactly one
// exported DataSource; hence the default export.
export default new DataSource(dataSourceOptions(validateEnv(process.env).DATABASE_URL));
