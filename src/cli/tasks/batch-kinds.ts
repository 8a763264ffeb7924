/**
 * Batch kinds that use the solvers (added to the `inverses` kind of the batch command).
 *
 * @module cli
 */
import type { BatchKind } from '../batch.js';

export const BATCH_EXTRA: Record<string, BatchKind> = {};
