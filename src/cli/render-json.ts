/**
 * Renders a report as JSON for machines (the shape is `docs/report-schema.json`).
 *
 * @module cli
 */
import type { Report } from './report.js';

/** The report as JSON text (sketch and exchange data left out: they go to `--sketch` and `--export`). */
export function renderJson(report: Report): string {
  const clean = {
    ...report,
    tasks: report.tasks.map(({ sketch: _sketch, exchange: _exchange, ...t }) => t),
  };
  return JSON.stringify(clean, null, 2) + '\n';
}
