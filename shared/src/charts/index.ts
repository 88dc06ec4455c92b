export * from './chart-theme';
