import { readdirSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';

// The console's layering (common practice, no source): app → features → components/hooks/lib/utils/config →
// shared. A feature never imports another feature or the app; shared building blocks import no feature; the
// console never imports the server.
const CONSOLE_DIR = path.dirname(fileURLToPath(import.meta.url));

function sourceFiles(dir: string): string[] {
  return readdirSync(dir, { withFileTypes: true }).flatMap((entry) => {
    const full = path.join(dir, entry.name);
    if (entry.isDirectory()) return sourceFiles(full);
    return /\.(ts|tsx)$/.test(entry.name) ? [full] : [];
  });
}

function importsOf(file: string): string[] {
  const text = readFileSync(file, 'utf8');
  return [...text.matchAll(/(?:import|export)[^'"]*?from\s+['"]([^'"]+)['"]|import\(\s*['"]([^'"]+)['"]\s*\)/g)].map(
    (match) => match[1] ?? match[2],
  );
}

/** Where an import lands, as a path relative to console/ (or "@shared/…", "@server/…", a package name). */
function target(file: string, specifier: string): string {
  if (specifier.startsWith('@console/')) return specifier.slice('@console/'.length);
  if (specifier.startsWith('.')) return path.relative(CONSOLE_DIR, path.resolve(path.dirname(file), specifier));
  return specifier;
}

const files = sourceFiles(CONSOLE_DIR).filter((file) => !file.endsWith('.test.ts'));
const edges = files.flatMap((file) =>
  importsOf(file).map((specifier) => ({ from: path.relative(CONSOLE_DIR, file), to: target(file, specifier) })),
);

describe('console import boundaries', () => {
  it('finds the console sources', () => {
    expect(files.length).toBeGreaterThan(20);
  });

  it('never imports the server', () => {
    expect(edges.filter((edge) => edge.to.startsWith('@server') || edge.to.startsWith('server/'))).toEqual([]);
  });

  it('keeps each feature to itself', () => {
    const crossing = edges.filter((edge) => {
      const from = /^features\/([^/]+)\//.exec(edge.from)?.[1];
      if (!from) return false;
      const to = /^features\/([^/]+)\//.exec(edge.to)?.[1];
      return edge.to.startsWith('app/') || (to !== undefined && to !== from);
    });
    expect(crossing).toEqual([]);
  });

  it('keeps the shared building blocks free of features and the app', () => {
    const layers = /^(components|hooks|lib|utils|config|styles)\//;
    const upward = edges.filter((edge) => layers.test(edge.from) && /^(features|app)\//.test(edge.to));
    expect(upward).toEqual([]);
  });
});
