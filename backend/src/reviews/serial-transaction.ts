/** Kept for callers that still import it: all SQLite writes take turns in one queue, methods' writeTransaction. */
export { writeTransaction as serialTransaction } from '../methods/write-transaction.js';
