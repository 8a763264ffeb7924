// A typedoc plugin: groups the API reference by area (the folder of src/ an export is
// defined in) instead of by kind, so that the page of `quadspread` reads Arithmetic,
// Geometry, Readings, Elevation, Coordinates (cogo), Geodesy, Uncertainty, Errors. The
// bound entries (quadspread/rational, /decimal, /float) use the same groups, by name.
// Works from the TypeScript symbols, so new exports are grouped without any tag.
import { Converter, ReflectionGroup, ReflectionKind } from 'typedoc';
import { relative, sep } from 'node:path';

const AREAS = {
  arithmetic: 'Arithmetic',
  geometry: 'Geometry',
  readings: 'Readings',
  elevation: 'Elevation',
  cogo: 'Coordinates (cogo)',
  geodesy: 'Geodesy',
  alignment: 'Alignment',
  adjustment: 'Adjustment',
  field: 'Field work',
  uncertainty: 'Uncertainty',
  io: 'Data exchange (io)',
  'errors.ts': 'Errors',
};
const ORDER = Object.values(AREAS);

/** @param {import('typedoc').Application} app */
export function load(app) {
  /** area by export name, from the generic entry's declarations */
  const areaOfName = new Map();
  /** area by reflection id */
  const areaOfReflection = new Map();
  let srcDir;

  app.converter.on(Converter.EVENT_BEGIN, () => {
    srcDir = `${app.options.getValue('basePath') || process.cwd()}${sep}src`;
  });

  app.converter.on(Converter.EVENT_CREATE_DECLARATION, (context, reflection) => {
    if (!reflection.parent || !reflection.parent.kindOf(ReflectionKind.Module)) return;
    const symbol = context.getSymbolFromReflection(reflection);
    const decl = symbol?.declarations?.[0];
    if (!decl) return;
    const rel = relative(srcDir ?? `${process.cwd()}${sep}src`, decl.getSourceFile().fileName);
    const first = rel.split(sep)[0];
    const area = AREAS[first];
    if (area) {
      areaOfReflection.set(reflection.id, area);
      // (the generated bound entries, src/entries/, are no area: their names keep the area of
      // the generic function they bind)
      if (!areaOfName.has(reflection.name)) areaOfName.set(reflection.name, area);
    }
  });

  // After typedoc's own grouping (priority -100): regroup the children of each module.
  app.converter.on(
    Converter.EVENT_RESOLVE_END,
    (context) => {
      const project = context.project;
      const modules = project.getReflectionsByKind(ReflectionKind.Module);
      for (const mod of modules) {
        const children = mod.children ?? [];
        if (children.length === 0) continue;
        const groups = new Map();
        for (const child of children) {
          let area = areaOfName.get(child.name) ?? areaOfReflection.get(child.id);
          if (
            !area &&
            (child.name === 'arithmetic' || child.name === 'Value' || child.name === 'Bound')
          )
            area = 'Arithmetic';
          if (!area && child.isReference?.())
            area = areaOfName.get(child.getTargetReflectionDeep().name);
          if (!area) {
            app.logger.warn(
              `typedoc-areas: ${mod.name}.${child.name} is not defined in an area folder of src/`,
            );
            area = 'Other';
          }
          if (!groups.has(area)) groups.set(area, new ReflectionGroup(area, child));
          groups.get(area).children.push(child);
        }
        const rank = (t) => (ORDER.indexOf(t) === -1 ? ORDER.length : ORDER.indexOf(t));
        mod.groups = [...groups.values()].sort((a, b) => rank(a.title) - rank(b.title));
        for (const g of mod.groups) g.children.sort((a, b) => a.name.localeCompare(b.name));
      }
    },
    -200,
  );
}
