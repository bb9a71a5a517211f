import fs from 'node:fs';
import path from 'node:path';
import { builtinModules } from 'node:module';
import ts from 'typescript';

/** One import found in a source file, with the repository-relative path it resolves to (if local). */
export interface ImportEdge {
  from: string;
  specifier: string;
  /** Repository-relative target for local imports (aliases and relative paths), else null. */
  target: string | null;
}

const IMPORT_PATTERN = /(?:^|[\s;])(?:import|export)\s[^'"`]*?from\s*['"]([^'"]+)['"]|(?:^|[\s;(])import\s*\(\s*['"]([^'"]+)['"]\s*\)|(?:^|[\s;])import\s+['"]([^'"]+)['"]/g;
const ALIASES: Record<string, string> = { '@shared/': 'shared/', '@server/': 'server/', '@console/': 'console/' };

function stripComments(source: string): string {
  return source.replace(/\/\*[\s\S]*?\*\//g, ' ').replace(/(^|[^:'"`\\])\/\/.*$/gm, '$1');
}

export function importsOf(file: string, source: string): ImportEdge[] {
  const edges: ImportEdge[] = [];
  for (const match of stripComments(source).matchAll(IMPORT_PATTERN)) {
    const specifier = match[1] ?? match[2] ?? match[3];
    let target: string | null = null;
    const alias = Object.keys(ALIASES).find((prefix) => specifier.startsWith(prefix));
    if (alias) target = ALIASES[alias] + specifier.slice(alias.length);
    else if (specifier.startsWith('.')) target = path.posix.normalize(path.posix.join(path.posix.dirname(file), specifier));
    edges.push({ from: file, specifier, target });
  }
  return edges;
}

const NODE_BUILTINS = new Set(builtinModules);
const isNodeBuiltin = (specifier: string) => specifier.startsWith('node:') || NODE_BUILTINS.has(specifier.split('/')[0]);

function featureOf(file: string): string | null {
  return /^console\/features\/([^/]+)\//.exec(file)?.[1] ?? null;
}

const under = (file: string | null, folder: string) => file !== null && (file === folder || file.startsWith(`${folder}/`));

/** Engine code must run in Node and in the browser; its tests run in Node only and are exempt. */
export const isEngineSource = (file: string) =>
  (under(file, 'shared/dsp') || under(file, 'shared/units')) && !/\.test\.tsx?$/.test(file);

/** Every broken direction rule in the given files (paths relative to the repository root, with `/`). */
export function findViolations(files: Array<{ path: string; source: string }>): string[] {
  const violations: string[] = [];
  for (const file of files) {
    const engine = isEngineSource(file.path);
    for (const edge of importsOf(file.path, file.source)) {
      const where = `${file.path} imports "${edge.specifier}"`;
      if (under(file.path, 'shared') && (under(edge.target, 'server') || under(edge.target, 'console'))) {
        violations.push(`${where}: shared/ must not depend on server/ or console/`);
      }
      if (under(file.path, 'console') && under(edge.target, 'server')) violations.push(`${where}: the console must not import the server`);
      if (under(file.path, 'server') && under(edge.target, 'console')) violations.push(`${where}: the server must not import the console`);
      if (engine && isNodeBuiltin(edge.specifier)) violations.push(`${where}: the engine must not use Node built-ins`);
      const fromFeature = featureOf(file.path);
      const toFeature = edge.target ? featureOf(`${edge.target}/`) ?? featureOf(edge.target) : null;
      if (fromFeature && toFeature && fromFeature !== toFeature) {
        violations.push(`${where}: console feature "${fromFeature}" must not import feature "${toFeature}"`);
      }
      if (fromFeature && under(edge.target, 'console/app')) violations.push(`${where}: console features must not import console/app`);
    }
  }
  return violations;
}

const SOURCE_EXTENSIONS = /\.(ts|tsx|mts|mjs|js)$/;

export function sourceFiles(root: string, folders: string[]): Array<{ path: string; source: string }> {
  const files: Array<{ path: string; source: string }> = [];
  const walk = (relative: string) => {
    const absolute = path.join(root, relative);
    if (!fs.existsSync(absolute)) return;
    for (const entry of fs.readdirSync(absolute, { withFileTypes: true })) {
      if (entry.name === 'node_modules' || entry.name.startsWith('.')) continue;
      const child = path.posix.join(relative, entry.name);
      if (entry.isDirectory()) walk(child);
      else if (SOURCE_EXTENSIONS.test(entry.name) && !entry.name.endsWith('.d.ts')) {
        files.push({ path: child, source: fs.readFileSync(path.join(root, child), 'utf8') });
      }
    }
  };
  folders.forEach(walk);
  return files;
}

/** Globals that exist only in browsers or only in Node (console, performance, timers exist in both). */
const ENVIRONMENT_GLOBALS = new Set([
  'window', 'document', 'navigator', 'location', 'localStorage', 'sessionStorage', 'HTMLElement', 'HTMLCanvasElement',
  'requestAnimationFrame', 'XMLHttpRequest', 'process', 'Buffer', 'global', '__dirname', '__filename', 'require', 'module',
  'setImmediate',
]);

/**
 * Uses of DOM or Node globals in engine sources. Each identifier with such a name is resolved by the
 * TypeScript checker against the plain ECMAScript library with no environment types: a local variable or
 * parameter named `window` resolves, a global `window` does not.
 */
export function engineGlobalViolations(root: string, files: string[]): string[] {
  const program = ts.createProgram(
    files.map((file) => path.join(root, file)),
    {
      target: ts.ScriptTarget.ES2022,
      module: ts.ModuleKind.ESNext,
      moduleResolution: ts.ModuleResolutionKind.Bundler,
      lib: ['lib.es2023.d.ts'],
      types: [],
      noEmit: true,
      skipLibCheck: true,
      noResolve: true,
    },
  );
  const checker = program.getTypeChecker();
  const violations: string[] = [];
  for (const sourceFile of program.getSourceFiles()) {
    const file = path.relative(root, sourceFile.fileName).split(path.sep).join('/');
    if (!isEngineSource(file)) continue;
    const visit = (node: ts.Node) => {
      if (ts.isIdentifier(node) && ENVIRONMENT_GLOBALS.has(node.text)) {
        const parent = node.parent;
        const isMemberName =
          (ts.isPropertyAccessExpression(parent) && parent.name === node) ||
          (ts.isPropertyAssignment(parent) && parent.name === node) ||
          (ts.isQualifiedName(parent) && parent.right === node) ||
          ts.isPropertySignature(parent) ||
          ts.isPropertyDeclaration(parent) ||
          ts.isMethodDeclaration(parent);
        if (!isMemberName && !checker.getSymbolAtLocation(node)) {
          const { line } = sourceFile.getLineAndCharacterOfPosition(node.getStart(sourceFile));
          violations.push(`${file}:${line + 1}: uses the global "${node.text}" (the engine may use neither DOM nor Node globals)`);
        }
      }
      ts.forEachChild(node, visit);
    };
    visit(sourceFile);
  }
  return violations;
}
