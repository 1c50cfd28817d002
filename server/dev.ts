/**
 * `npm run dev`: the API under `tsx watch` on PORT (3000) and the Vite dev server on 5173, which
 * proxies /api to it. Both stop together.
 */
import { spawn } from 'node:child_process';

const children = [
  spawn('npx', ['tsx', 'watch', 'server/index.ts', '--api-only'], { stdio: 'inherit' }),
  spawn('npx', ['vite'], { stdio: 'inherit' }),
];
function stopAll(): void {
  for (const child of children) child.kill('SIGTERM');
}
for (const child of children) child.on('exit', stopAll);
process.on('SIGINT', stopAll);
process.on('SIGTERM', stopAll);
