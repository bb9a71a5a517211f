// Worker threads start without the parent's TypeScript loader: register tsx here, then load the TS worker.
import { register } from 'tsx/esm/api';

register({ tsconfig: new URL('../../tsconfig.json', import.meta.url).pathname });
const worker = await import('./engine-worker.ts');

export default worker.default;
