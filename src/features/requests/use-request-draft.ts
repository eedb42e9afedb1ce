// Saving a request form without ever losing what was typed:
//  - every change is kept on this device at once (draft-store), until the server has it;
//  - an existing draft saves itself a moment after the last edit (and on the Save button);
//  - when the network drops, the form says so and tries again (and when the browser is back online);
//  - when someone else saved first (409 stale_version), nothing is overwritten: the person chooses.
import { useCallback, useEffect, useRef, useState } from 'react';
import type { FormikProps } from 'formik';
import type { EditableRequestField, RequestDetail, UpdateRequestInput } from '@shared/schemas/change-requests';
import { isApiError, toUserMessage } from '@/api/errors';
import { isStaleRequestError } from '@/api/requests';
import { clearDraft, loadDraft, saveDraft } from './draft-store';
import {
  comparable,
  createPayload,
  emptyRequestValues,
  serverErrorsToForm,
  updatePayload,
  validateRequestForm,
  valuesFromDetail,
  type RequestFormValues,
} from './forms';
import { useCreateRequest, useUpdateRequest } from './hooks';
import { NEW_REQUEST, uploadQueue } from './upload-queue';

export type SaveState =
  | { kind: 'clean' }
  | { kind: 'pending' }
  | { kind: 'saving' }
  | { kind: 'saved'; at: number }
  | { kind: 'offline'; retryAt: number | null }
  | { kind: 'invalid' }
  | { kind: 'refused'; message: string }
  | { kind: 'conflict'; current: RequestDetail | null };

/** Wait before an automatic save after the last keystroke. */
export const AUTOSAVE_MS = 1500;
const LOCAL_MS = 300;
const retryDelay = (attempt: number) => Math.min(60_000, 5_000 * 2 ** attempt);

const isOffline = (e: unknown) => isApiError(e) && (e.code === 'network' || e.status === 0 || e.status >= 500);

export interface DraftSetup {
  userId: string;
  /** The request being edited; null for a new one. */
  request: RequestDetail | null;
}

/** The values to open the form with: the unsent copy kept on this device, when there is one. */
export function initialDraft({ userId, request }: DraftSetup): { values: RequestFormValues; restoredAt: number | null; staleBase: boolean } {
  const key = request?.id ?? NEW_REQUEST;
  const server = request ? valuesFromDetail(request) : emptyRequestValues();
  const local = loadDraft(userId, key);
  if (local && comparable(local.values) !== comparable(server)) {
    return { values: local.values, restoredAt: local.savedAt, staleBase: !!request && local.baseVersion !== request.version };
  }
  if (local) clearDraft(userId, key);
  return { values: server, restoredAt: null, staleBase: false };
}

export function useRequestDraft(
  setup: DraftSetup & {
    f: FormikProps<RequestFormValues>;
    editable: readonly EditableRequestField[];
    staleBase: boolean;
    onCreated: (r: RequestDetail) => void;
  },
) {
  const { userId, request, f, editable, onCreated } = setup;
  const key = request?.id ?? NEW_REQUEST;
  const create = useCreateRequest();
  const update = useUpdateRequest(request?.id ?? '');

  const [state, setState] = useState<SaveState>(() => (setup.staleBase && request ? { kind: 'conflict', current: request } : { kind: 'clean' }));
  const [unsentCopy, setUnsentCopy] = useState<RequestFormValues | null>(null);
  const versionRef = useRef<number | null>(request ? (setup.staleBase ? -1 : request.version) : null);
  const baselineRef = useRef(comparable(request ? valuesFromDetail(request) : emptyRequestValues()));
  const lastSentRef = useRef<string | null>(null);
  const valuesRef = useRef(f.values);
  valuesRef.current = f.values;
  const savingRef = useRef(false);
  const attemptRef = useRef(0);
  const retryTimer = useRef<ReturnType<typeof setTimeout> | null>(null);
  const stateRef = useRef(state);
  stateRef.current = state;

  const now = comparable(f.values);
  const dirty = now !== baselineRef.current;

  // Keep the unsent form on this device.
  useEffect(() => {
    const t = setTimeout(() => {
      if (comparable(valuesRef.current) === baselineRef.current) clearDraft(userId, key);
      else saveDraft(userId, key, { values: valuesRef.current, baseVersion: versionRef.current, savedAt: Date.now() });
    }, LOCAL_MS);
    return () => clearTimeout(t);
  }, [now, userId, key]);

  const send = useCallback(
    async (mode: 'auto' | 'explicit', values: RequestFormValues): Promise<void> => {
      if (savingRef.current) return;
      savingRef.current = true;
      if (retryTimer.current) clearTimeout(retryTimer.current);
      setState({ kind: 'saving' });
      let body: UpdateRequestInput | null = null;
      try {
        if (!request) {
          const r = await create.mutateAsync(createPayload(values));
          clearDraft(userId, NEW_REQUEST);
          baselineRef.current = comparable(values);
          attemptRef.current = 0;
          uploadQueue.adopt(r.id);
          setState({ kind: 'saved', at: Date.now() });
          onCreated(r);
          return;
        }
        body = updatePayload(values, versionRef.current ?? request.version, editable, { auto: mode === 'auto' });
        const { version: _v, ...sent } = body;
        lastSentRef.current = JSON.stringify(sent);
        const r = await update.mutateAsync(body);
        versionRef.current = r.version;
        attemptRef.current = 0;
        // New items now have ids; a new derivative product now exists. Apply both to what was
        // sent (the new baseline) and to the form as it is now (the person may have typed on).
        const ids = new Map(values.items.map((it, i) => [it.key, r.items[i]?.id]));
        const settle = (v: RequestFormValues): RequestFormValues => {
          let out = v;
          if (v.items.some((it) => !it.id && ids.get(it.key))) out = { ...out, items: out.items.map((it) => (it.id ? it : { ...it, id: ids.get(it.key) })) };
          if (body?.newDerivative && r.derivativeProduct) out = { ...out, derivativeMode: 'existing', derivative: { ...r.derivativeProduct }, newDerivative: { sku: '', name: '' } };
          return out;
        };
        baselineRef.current = comparable(settle(values));
        const current = valuesRef.current;
        const settled = settle(current);
        if (settled !== current) await f.setValues(settled, false);
        if (comparable(settled) === baselineRef.current) clearDraft(userId, key);
        setState(comparable(settled) === baselineRef.current ? { kind: 'saved', at: Date.now() } : { kind: 'pending' });
      } catch (e) {
        if (isStaleRequestError(e)) {
          setState({ kind: 'conflict', current: e.current });
        } else if (isOffline(e)) {
          const delay = retryDelay(attemptRef.current++);
          setState({ kind: 'offline', retryAt: Date.now() + delay });
          retryTimer.current = setTimeout(() => void retryRef.current(mode), delay);
        } else {
          lastSentRef.current = null;
          if (isApiError(e) && e.fieldErrors) {
            const mapped = serverErrorsToForm(e.fieldErrors);
            f.setErrors(mapped.errors as never);
            void f.setTouched({ ...(f.touched as object), ...mapped.touched } as never, false);
            setState({ kind: 'refused', message: [e.message, ...mapped.other].join(' ') });
          } else {
            setState({ kind: 'refused', message: toUserMessage(e) });
          }
        }
      } finally {
        savingRef.current = false;
      }
    },
    // eslint-disable-next-line react-hooks/exhaustive-deps
    [request, editable, userId, key],
  );

  const retry = useCallback(
    async (mode: 'auto' | 'explicit') => {
      const values = valuesRef.current;
      try {
        await validateRequestForm(values);
      } catch {
        setState({ kind: 'invalid' });
        return;
      }
      await send(mode, values);
    },
    [send],
  );

  const retryRef = useRef(retry);
  retryRef.current = retry;

  // Formik's submit (the Save button) lands here after its own validation passed.
  const submit = useCallback((values: RequestFormValues) => send('explicit', values), [send]);

  // An existing draft saves itself after the last edit.
  useEffect(() => {
    if (!request || !dirty) return;
    const s = stateRef.current.kind;
    if (s === 'conflict' || s === 'saving' || s === 'offline') return;
    setState((old) => (old.kind === 'refused' || old.kind === 'invalid' || old.kind === 'pending' ? old : { kind: 'pending' }));
    const t = setTimeout(() => {
      const values = valuesRef.current;
      const { version: _v, ...would } = updatePayload(values, 0, editable, { auto: true });
      // Nothing new to send (e.g. only a new product's SKU is typed, which waits for Save).
      if (JSON.stringify(would) === lastSentRef.current) return;
      void retry('auto');
    }, AUTOSAVE_MS);
    return () => clearTimeout(t);
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [now, dirty, request?.id]);

  // Back online: send at once.
  useEffect(() => {
    const w = globalThis as { addEventListener?: (t: string, fn: () => void) => void; removeEventListener?: (t: string, fn: () => void) => void };
    if (!w.addEventListener) return;
    const online = () => {
      if (stateRef.current.kind === 'offline') void retry('explicit');
    };
    w.addEventListener('online', online);
    return () => w.removeEventListener?.('online', online);
  }, [retry]);

  useEffect(() => () => void (retryTimer.current && clearTimeout(retryTimer.current)), []);

  /** Drops the copy on this device and shows the saved request again. */
  const discardLocal = useCallback(() => {
    clearDraft(userId, key);
    const server = request ? valuesFromDetail(request) : emptyRequestValues();
    baselineRef.current = comparable(server);
    if (!request) uploadQueue.clear(NEW_REQUEST);
    f.resetForm({ values: server });
    setState({ kind: 'clean' });
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [userId, key, request]);

  /** After a 409: take their version (keeping mine visible) or save mine over it. */
  const resolveConflict = useCallback(
    (choice: 'theirs' | 'mine') => {
      if (stateRef.current.kind !== 'conflict') return;
      const current = stateRef.current.current;
      if (!current) {
        setState({ kind: 'refused', message: 'The current version could not be read. Reload the page; what you typed stays on this device.' });
        return;
      }
      versionRef.current = current.version;
      lastSentRef.current = null;
      if (choice === 'theirs') {
        setUnsentCopy(valuesRef.current);
        const theirs = valuesFromDetail(current);
        baselineRef.current = comparable(theirs);
        clearDraft(userId, key);
        f.resetForm({ values: theirs });
        setState({ kind: 'saved', at: Date.now() });
      } else {
        setState({ kind: 'pending' });
        void retry('explicit');
      }
    },
    // eslint-disable-next-line react-hooks/exhaustive-deps
    [userId, key, retry],
  );

  const retryNow = useCallback(() => void retry('explicit'), [retry]);

  // Typed since the last save, nothing sent yet: say so (an autosave, if any, follows).
  const shown: SaveState = dirty && (state.kind === 'clean' || state.kind === 'saved') ? { kind: 'pending' } : state;

  return { state: shown, dirty, submit, retryNow, discardLocal, resolveConflict, unsentCopy, dismissUnsent: () => setUnsentCopy(null) };
}
