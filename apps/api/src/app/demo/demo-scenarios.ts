import type { AnalysisSpec } from '@tallyfit/engine';

/**
 * Invented scenarios for the demo database. Every number here is made up for Tallyfit's demo;
 * none comes from a published study.
 */
export const DEMO_ANALYSES: ReadonlyArray<{ title: string; spec: AnalysisSpec }> = [
  {
    title: 'Checkout redesign: did traffic split 50/50?',
    spec: {
      observed: { labels: ['control', 'redesign'], counts: [50_412, 49_233] },
      hypothesis: { kind: 'equal' },
    },
  },
  {
    title: 'Regional panel sample against census shares',
    spec: {
      observed: { labels: ['north', 'south', 'east', 'west', 'central'], counts: [212, 251, 168, 139, 230] },
      hypothesis: { kind: 'proportions', values: [0.22, 0.24, 0.18, 0.14, 0.22] },
    },
  },
  {
    title: 'Help-desk tickets by weekday',
    spec: {
      observed: { labels: ['Mon', 'Tue', 'Wed', 'Thu', 'Fri'], counts: [88, 71, 64, 69, 58] },
      hypothesis: { kind: 'equal' },
    },
  },
];

/** The invented study the demo analyses belong to. */
export const DEMO_STUDY = {
  name: 'Bramblewick Goods storefront checks',
  description: 'Invented demo study: traffic splits, panel make-up and support load for Bramblewick Goods, a made-up online shop.',
};
