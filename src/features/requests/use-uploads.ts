import { useEffect, useSyncExternalStore } from 'react';
import { useQueryClient } from '@tanstack/react-query';
import { addAttachmentToCache } from './hooks';
import { uploadQueue, type QueuedUpload } from './upload-queue';

/** The queued uploads of one request ("new" for the request being written), kept live. */
export function useUploads(requestKey: string): QueuedUpload[] {
  const qc = useQueryClient();
  useEffect(() => {
    uploadQueue.setOnUploaded((requestId, attachment) => void addAttachmentToCache(qc, requestId, attachment));
  }, [qc]);
  const all = useSyncExternalStore((listener: () => void) => uploadQueue.subscribe(listener), uploadQueue.snapshot, uploadQueue.snapshot);
  return all.filter((e) => e.requestKey === requestKey);
}
