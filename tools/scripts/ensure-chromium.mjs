// The browser tests drive Debian's Chromium. Install it when this process may (root with apt);
// otherwise say exactly which command is needed. Never skip the browser tests silently.
import { spawnSync } from 'node:child_process';
import { existsSync } from 'node:fs';

export const CHROMIUM_PATH = process.env.CHROMIUM_PATH ?? '/usr/bin/chromium';

export function ensureChromium() {
  if (existsSync(CHROMIUM_PATH)) return { ok: true };
  const canApt = process.getuid?.() === 0 && existsSync('/usr/bin/apt-get');
  if (canApt) {
    console.log('Chromium is missing: installing it with apt-get (Debian package "chromium")…');
    const options = { stdio: 'inherit', env: { ...process.env, DEBIAN_FRONTEND: 'noninteractive' } };
    spawnSync('apt-get', ['-o', 'DPkg::Lock::Timeout=1200', 'update'], options);
    spawnSync('apt-get', ['-o', 'DPkg::Lock::Timeout=1200', 'install', '-y', 'chromium'], options);
    if (existsSync(CHROMIUM_PATH)) return { ok: true };
  }
  return {
    ok: false,
    message: `Chromium is not installed at ${CHROMIUM_PATH}. Install it with: sudo apt-get install -y chromium (or set CHROMIUM_PATH).`,
  };
}
