/**
 * The script of the batch command's worker threads (`dist/batch-worker.js`): the batch code
 * alone, without the rest of the command, so that a worker starts quickly.
 *
 * @module cli
 */
import { runBatchWorker } from './batch-worker.js';

runBatchWorker();
