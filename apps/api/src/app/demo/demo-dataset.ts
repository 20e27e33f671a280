import { mkdirSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import type { Knex } from 'knex';
import type { User } from '@tallyfit/contracts';
import { createDataset } from '../datasets/datasets.service';

/**
 * An invented raw-rows file for the demo study: one row per help-desk ticket, with the weekday it
 * arrived and the channel it came through. Its weekday counts are those of the demo analysis of
 * tickets by weekday, so the console shows where such counts come from.
 */
export const DEMO_TICKETS_BY_WEEKDAY: ReadonlyArray<readonly [weekday: string, tickets: number]> = [
  ['Mon', 88],
  ['Tue', 71],
  ['Wed', 64],
  ['Thu', 69],
  ['Fri', 58],
];
const CHANNELS = ['e-mail', 'phone', 'chat'];

export function demoTicketsCsv(): string {
  const lines = ['ticket,weekday,channel'];
  let ticket = 1000;
  for (const [weekday, tickets] of DEMO_TICKETS_BY_WEEKDAY) {
    for (let i = 0; i < tickets; i++, ticket++) lines.push(`T-${ticket},${weekday},${CHANNELS[(ticket * 7) % CHANNELS.length]}`);
  }
  return lines.join('\n') + '\n';
}

/** Stores the demo file as an upload by `owner` into the demo study, with the weekday column chosen. */
export async function seedDemoDataset(db: Knex, dataDir: string, owner: User, studyId: number): Promise<void> {
  const folder = join(dataDir, 'uploads-in-progress');
  mkdirSync(folder, { recursive: true });
  const path = join(folder, 'demo-support-tickets.csv');
  const content = demoTicketsCsv();
  writeFileSync(path, content);
  await createDataset(
    db,
    dataDir,
    owner,
    studyId,
    { path, originalName: 'support-tickets.csv', sizeBytes: Buffer.byteLength(content), kind: 'csv' },
    { shape: 'raw', column: 'weekday' },
  );
}
