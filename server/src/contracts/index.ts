// The contracts in one import: what crosses a boundary between the CLI, the server and the console.
export * from './errors.js';
export * from './ingest.schemas.js';
export * from './result-columns.js';
export * from './result-csv.js';
export * from './result-fingerprint.js';
export * from './run-spec.keys.js';
export * from './run-spec.load.js';
export * from './run-spec.messages.js';
export * from './run-spec.schema.js';
export { calendarDate, isCalendarDate } from './run-spec.fields.js';
