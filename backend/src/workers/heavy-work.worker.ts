import 'reflect-metadata';
import { runHeavyTask } from './heavy-work.js';

// Piscina runs the default export of this file in each worker thread.
export default runHeavyTask;
