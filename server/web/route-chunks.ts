/**
 * The route chunks of the export, by route file ("./(tabs)/index.tsx" → "/_expo/static/js/web/index-….js"),
 * read from the entry's route context module: each route's getter names a dependency index, and the
 * module's dependency map carries the chunk path of each async dependency under "paths".
 */
export function routeChunks(entrySource: string): Map<string, string> {
  const anchor = entrySource.indexOf('"./_layout.tsx"');
  if (anchor < 0) throw new Error('server/web/route-chunks.ts: no route context ("./_layout.tsx") in the entry chunk; update routeChunks()');
  const start = entrySource.lastIndexOf('__d(function', anchor);
  const next = entrySource.indexOf('__d(function', anchor);
  const moduleText = entrySource.slice(start, next < 0 ? entrySource.length : next);
  const dependencyMapText = /,\d+,(\{"0":[^]*?"paths":\{[^}]*\}\})\)/.exec(moduleText)?.[1];
  if (!dependencyMapText) throw new Error('server/web/route-chunks.ts: the route context has no chunk paths; update routeChunks()');
  const dependencyMap = JSON.parse(dependencyMapText) as Record<string, number> & { paths: Record<string, string> };
  const chunks = new Map<string, string>();
  for (const match of moduleText.matchAll(/"(\.\/[^"]+)":\{[^{}]*?\w+\[(\d+)\],\w+\.paths\)/g)) {
    const moduleId = dependencyMap[match[2] ?? ''];
    const chunk = moduleId === undefined ? undefined : dependencyMap.paths[String(moduleId)];
    if (match[1] && chunk) chunks.set(match[1], chunk);
  }
  return chunks;
}

/** The landing route: app/index or the index of a (group) at the root, e.g. "./(tabs)/index.tsx". */
export const LANDING_ROUTE = /^\.\/(\([^/]+\)\/)?index\.tsx?$/;
export const LAYOUT_ROUTE = /(^|\/)_layout\.tsx?$/;
