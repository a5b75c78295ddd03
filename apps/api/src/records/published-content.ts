import type { PublishedCell, PublishedUpload, UserRef } from '@cribra/contracts';

/**
 * What a published record shows beside the lock record itself, taken once when it is published
 * (the notebook is locked then, so none of it can change): the notebook's summary and authors,
 * each cell's outputs (from the record when it holds them, else from the recorded run) and the uploads.
 */
export interface PublishedContent {
  title: string;
  summary: string;
  authors: UserRef[];
  publishedBy: UserRef;
  cells: PublishedCell[];
  uploads: Array<PublishedUpload & { uploadId: string | null }>;
}
