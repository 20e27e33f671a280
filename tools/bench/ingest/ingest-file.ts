/**
 * The benchmark's file: invented sales events, one row each (`id,region,amount`), five regions of
 * unequal shares and amounts 0–999. Written in chunks, so generating it takes little memory.
 */
import { once } from 'node:events';
import { createWriteStream } from 'node:fs';

const REGIONS: Array<[name: string, percent: number]> = [
  ['north', 30],
  ['south', 25],
  ['east', 20],
  ['west', 15],
  ['centre', 10],
];
const regionByPercent = REGIONS.flatMap(([name, percent]) => Array.from({ length: percent }, () => name));

export async function writeSalesFile(path: string, rows: number, separator = ','): Promise<void> {
  const out = createWriteStream(path);
  out.write(['id', 'region', 'amount'].join(separator) + '\n');
  for (let start = 1; start <= rows; start += 50_000) {
    let chunk = '';
    for (let i = start; i < Math.min(rows + 1, start + 50_000); i++) {
      chunk += `${i}${separator}${regionByPercent[(Math.imul(i, 2654435761) >>> 0) % 100]}${separator}${(i * 7919) % 1000}\n`;
    }
    if (!out.write(chunk)) await once(out, 'drain');
  }
  out.end();
  await once(out, 'finish');
}
