/** Start the compiled product (server and stand-ins) as real child processes for browser tests. */
import { spawn, type ChildProcess } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';

export const ROOT = path.resolve(__dirname, '..', '..');

export interface Started {
  process: ChildProcess;
  output: () => string;
  stop(): Promise<void>;
}

export function startNode(script: string, env: Record<string, string>, name: string): Started {
  const file = path.join(ROOT, script);
  if (!fs.existsSync(file)) throw new Error(`${file} is missing: build first (npm test builds it)`);
  const child = spawn(process.execPath, [file], { cwd: ROOT, env: { ...process.env, ...env }, stdio: ['ignore', 'pipe', 'pipe'] });
  let out = '';
  child.stdout!.on('data', (d) => (out += d));
  child.stderr!.on('data', (d) => (out += d));
  return {
    process: child,
    output: () => `[${name}]\n${out}`,
    stop: () =>
      new Promise<void>((resolve) => {
        if (child.exitCode !== null) return resolve();
        child.once('exit', () => resolve());
        child.kill('SIGTERM');
        setTimeout(() => child.kill('SIGKILL'), 5000).unref();
      }),
  };
}

export async function waitForHttp(url: string, started?: Started, timeoutMs = 30_000): Promise<void> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    try {
      const res = await fetch(url);
      if (res.ok) return;
    } catch {
      // not up yet
    }
    if (started && started.process.exitCode !== null) throw new Error(`process exited early:\n${started.output()}`);
    if (Date.now() > deadline) throw new Error(`timed out waiting for ${url}\n${started?.output() ?? ''}`);
    await new Promise((r) => setTimeout(r, 250));
  }
}
