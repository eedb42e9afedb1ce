import { useEffect, useState } from 'react';

/**
 * The record a form edits: the version loaded when the form opened. A background refetch never
 * replaces what someone is typing; only `reload()` (after a conflict) starts the form afresh.
 */
export function useEditSnapshot<T>(query: { data: T | undefined; refetch: () => Promise<{ data?: T | undefined }> }) {
  const [snapshot, setSnapshot] = useState<T | null>(null);
  const [reloading, setReloading] = useState(false);
  useEffect(() => {
    if (!snapshot && query.data) setSnapshot(query.data);
  }, [snapshot, query.data]);
  const reload = async () => {
    setReloading(true);
    const fresh = await query.refetch();
    setReloading(false);
    if (fresh.data) setSnapshot(fresh.data);
  };
  return { snapshot, reloading, reload };
}
