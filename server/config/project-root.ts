import fs from 'node:fs';
import path from 'node:path';

/** The repository root (the folder holding Sidecheck's package.json), from source or compiled code. */
export function projectRoot(start = __dirname): string {
  let dir = start;
  for (;;) {
    const manifest = path.join(dir, 'package.json');
    if (fs.existsSync(manifest) && JSON.parse(fs.readFileSync(manifest, 'utf8')).name === 'sidecheck') return dir;
    const parent = path.dirname(dir);
    if (parent === dir) throw new Error('projectRoot: package.json of sidecheck not found above ' + start);
    dir = parent;
  }
}
