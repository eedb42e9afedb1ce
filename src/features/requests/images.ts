// Which pictures the compare view and the region editor show.
import type { ImageRole, RegionMark } from '@shared/schemas/change-items';
import type { Attachment } from '@shared/schemas/change-requests';
import { attachmentSrc } from '@/api/requests';
import type { CompareImage, CompareMark } from './components/image-compare';
import type { QueuedUpload } from './upload-queue';

/** The picture of a kind the compare view shows first: one for the whole request, else the first. */
export function mainAttachment(attachments: readonly Attachment[], role: ImageRole): Attachment | null {
  const ofKind = attachments.filter((a) => a.kind === role);
  return ofKind.find((a) => a.itemId === null) ?? ofKind[0] ?? null;
}

export const compareImageOf = (a: Attachment): CompareImage => ({ uri: attachmentSrc(a), width: a.width, height: a.height, name: a.filename });

const queuedImageOf = (q: QueuedUpload): CompareImage | null =>
  q.previewUri ? { uri: q.previewUri, width: q.width, height: q.height, name: q.fileName } : null;

/** The stored picture of a role, or one still waiting to be sent (its local preview). */
export function roleImage(attachments: readonly Attachment[], queued: readonly QueuedUpload[], role: ImageRole): CompareImage | null {
  const a = mainAttachment(attachments, role);
  if (a) return compareImageOf(a);
  const q = queued.find((x) => x.kind === role && x.previewUri);
  return q ? queuedImageOf(q) : null;
}

/** Item marks, numbered as the items are. */
export function marksOf(items: readonly { region?: RegionMark | null }[]): CompareMark[] {
  return items.flatMap((item, i) =>
    item.region ? [{ role: item.region.imageRole, label: String(i + 1), mark: { shape: item.region.shape, x: item.region.x, y: item.region.y, w: item.region.w, h: item.region.h } }] : [],
  );
}
