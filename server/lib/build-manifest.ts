import { readFileSync } from 'node:fs';
import { join } from 'node:path';

/** One entry of the manifest Vite writes with `build.manifest` (dist/.vite/manifest.json). */
export interface ManifestChunk {
  file: string;
  src?: string;
  /** The chunk's name (a page's module, or a shared piece's first module), also when its file goes by its hash alone. */
  name?: string;
  isEntry?: boolean;
  imports?: string[];
  dynamicImports?: string[];
}

export type BuildManifest = Record<string, ManifestChunk>;

export function readBuildManifest(clientDir: string): BuildManifest {
  return JSON.parse(readFileSync(join(clientDir, '.vite', 'manifest.json'), 'utf8')) as BuildManifest;
}

/** The manifest keys of these chunks and of every chunk they import statically, however deep. */
export function staticClosure(manifest: BuildManifest, keys: string[], seen = new Set<string>()): Set<string> {
  for (const key of keys) {
    const chunk = manifest[key];
    if (seen.has(key) || !chunk) continue;
    seen.add(key);
    staticClosure(manifest, chunk.imports ?? [], seen);
  }
  return seen;
}
