import { fileURLToPath } from 'node:url';
import path from 'node:path';

export const repoRoot = path.resolve(fileURLToPath(new URL('../../..', import.meta.url)));
export const dataRoot = path.join(repoRoot, '.data');
export const fromRoot = (...parts) => path.join(repoRoot, ...parts);
