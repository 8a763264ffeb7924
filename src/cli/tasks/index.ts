/**
 * The task kinds the runner knows, in the order the schema and the docs list them.
 *
 * @module cli
 */
import type { TaskKind } from '../task.js';
import { areaTask } from './area.js';
import { heightTask } from './height.js';
import { baseHeightTask } from './base-height.js';
import { pathGradeTask } from './path-grade.js';
import { inlineHeightTask } from './inline-height.js';
import { traverseTask } from './traverse.js';
import { triangleTask } from './triangle.js';
import { intersectionTask } from './intersection.js';
import { levellingTask } from './levelling.js';
import { resectionTask } from './resection.js';
import { trigHeightTask } from './trig-height.js';
import { geodeticTask } from './geodetic.js';
import { alignmentTask } from './alignment.js';
import { stationSetupTask } from './station-setup.js';
import { settingOutTask } from './setting-out.js';
import { levellingNetworkTask } from './levelling-network.js';
import { planeNetworkTask } from './plane-network.js';

export const TASK_KINDS: readonly TaskKind[] = [
  heightTask,
  baseHeightTask,
  inlineHeightTask,
  trigHeightTask,
  pathGradeTask,
  triangleTask,
  traverseTask,
  areaTask,
  intersectionTask,
  resectionTask,
  levellingTask,
  geodeticTask,
  alignmentTask,
  stationSetupTask,
  settingOutTask,
  levellingNetworkTask,
  planeNetworkTask,
];
