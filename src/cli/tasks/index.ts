/**
 * The task kinds the runner knows, in the order the schema and the docs list them.
 *
 * @module cli
 */
import type { TaskKind } from '../task.js';
import { areaTask } from './area.js';
import { traverseTask } from './traverse.js';
import { triangleTask } from './triangle.js';
import { intersectionTask } from './intersection.js';

export const TASK_KINDS: readonly TaskKind[] = [triangleTask, traverseTask, areaTask, intersectionTask];
