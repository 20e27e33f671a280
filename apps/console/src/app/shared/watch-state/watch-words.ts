import type { BatchSource, DeliveryStatus, WatchAlertState, WatchFeed, WatchState } from '@tallyfit/contracts';

/** A watch's state as people read it. */
export const WATCH_STATE_WORDS: Record<WatchState, string> = {
  holding: 'Holding',
  alarm: 'Alarm raised',
  paused: 'Paused',
};

/** What each state means, for a hint beside the state. */
export const WATCH_STATE_MEANINGS: Record<WatchState, string> = {
  holding: 'No sign so far that the counts differ from what was expected.',
  alarm: 'The counts have drifted from what was expected.',
  paused: 'Paused: no batches are taken in and scheduled queries do not run.',
};

export const ALERT_STATE_WORDS: Record<WatchAlertState, string> = {
  none: 'Nothing to acknowledge',
  waiting: 'Waiting for a lead',
  acknowledged: 'Acknowledged',
};

export const FEED_WORDS: Record<WatchFeed['kind'], string> = {
  push: 'Sent by a pipeline',
  pull: 'Scheduled query',
  upload: 'Uploaded files',
};

export const BATCH_SOURCE_WORDS: Record<BatchSource, string> = {
  push: 'pipeline',
  pull: 'scheduled query',
  upload: 'upload',
};

export const DELIVERY_STATUS_WORDS: Record<DeliveryStatus, string> = {
  pending: 'still trying',
  delivered: 'delivered',
  failed: 'gave up',
};
