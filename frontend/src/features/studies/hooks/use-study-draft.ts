import { canonicalJson, type StudyDto, type StudyMeta } from '@meritline/shared';
import { useQueryClient } from '@tanstack/react-query';
import { useCallback, useEffect, useMemo, useRef, useState } from 'react';
import { isApiError } from '@/lib/api-client';
import { useSession } from '@/lib/auth';
import { studiesQueries } from '../api/studies-queries';
import { useUpdateStudy, type StudyChanges } from '../api/update-study';
import { accuracyDesignProblems, accuracyItems, dataToDraft, draftToData, type DataDraft } from '../utils/study-sheets';

export interface StudyDraft {
  title: string;
  meta: StudyMeta;
  data: DataDraft;
}

export type SaveState =
  | { kind: 'saved'; at: Date | null }
  | { kind: 'pending' }
  | { kind: 'saving' }
  | { kind: 'needs-reason' }
  | { kind: 'incomplete'; problems: string[] }
  | { kind: 'conflict' }
  | { kind: 'error'; message: string; details: string[] };

const AUTOSAVE_DELAY_MS = 900;

const draftFrom = (study: StudyDto): StudyDraft => ({ title: study.title, meta: { ...study.meta }, data: dataToDraft(study.data) });

interface Payload {
  title: string;
  meta: string;
  data: string;
}

const payloadOf = (draft: StudyDraft): Payload => ({
  title: draft.title.trim(),
  meta: canonicalJson(draft.meta),
  data: canonicalJson(draftToData(draft.data)),
});

/** Only draft and returned studies change; submitted and approved ones are on record. */
export const isEditable = (study: Pick<StudyDto, 'status'>) => study.status === 'draft' || study.status === 'returned';

/** Why the signed-in user may not change the study, or null when they may. */
export function readOnlyReason(study: Pick<StudyDto, 'status' | 'author'>, userId: string | undefined): string | null {
  if (study.status === 'approved') return 'This study is approved and can no longer be changed.';
  if (study.status === 'submitted') return 'This study is submitted for review and can no longer be changed.';
  if (study.author.id !== userId) return `Only its author, ${study.author.name}, may change this study; you can read it.`;
  return null;
}

/**
 * The study as the analyst edits it, saved in the background: each change waits a moment for the
 * next keystroke, then the changed parts go to the server with the lock version last read. A stale
 * lock version (409) stops saving and says so; nothing is overwritten.
 */
export function useStudyDraft(initial: StudyDto) {
  const queryClient = useQueryClient();
  const { user } = useSession();
  const userId = user?.id;
  const { mutateAsync } = useUpdateStudy(initial.id);
  const [draft, setDraft] = useState(() => draftFrom(initial));
  const [server, setServer] = useState(initial);
  const [state, setState] = useState<SaveState>({ kind: 'saved', at: null });
  const [reason, setReasonState] = useState('');

  const latest = useRef(draft);
  const saved = useRef(payloadOf(draft));
  const lockVersion = useRef(initial.lockVersion);
  const status = useRef(initial.status);
  const reasonRef = useRef('');
  const timer = useRef<ReturnType<typeof setTimeout> | null>(null);
  const inFlight = useRef<Promise<boolean> | null>(null);
  const stopped = useRef(false);
  const lockedReason = readOnlyReason(server, userId);
  const editable = lockedReason === null;
  const mayEdit = useRef(editable);
  mayEdit.current = editable;

  const adopt = useCallback(
    (study: StudyDto) => {
      const next = draftFrom(study);
      latest.current = next;
      saved.current = payloadOf(next);
      lockVersion.current = study.lockVersion;
      status.current = study.status;
      stopped.current = false;
      setDraft(next);
      setServer(study);
      setState({ kind: 'saved', at: new Date() });
      queryClient.setQueryData(studiesQueries.detail(study.id).queryKey, study);
    },
    [queryClient],
  );

  /** Sends what changed since the last save, again until nothing is left; true when all is saved. */
  const saveNow = useCallback(async (): Promise<boolean> => {
    if (timer.current) {
      clearTimeout(timer.current);
      timer.current = null;
    }
    for (;;) {
      while (inFlight.current) await inFlight.current;
      if (stopped.current) return false;
      const payload = payloadOf(latest.current);
      const changes: StudyChanges = { lockVersion: lockVersion.current };
      if (payload.title !== saved.current.title && payload.title !== '') changes.title = payload.title;
      if (payload.meta !== saved.current.meta) changes.meta = latest.current.meta;
      if (payload.data !== saved.current.data) changes.data = JSON.parse(payload.data) as Record<string, unknown>;
      if (!changes.title && !changes.meta && !changes.data) {
        setState((s) => (s.kind === 'pending' || s.kind === 'saving' ? { kind: 'saved', at: new Date() } : s));
        return true;
      }
      // The server refuses an unbalanced accuracy design: nothing is sent until it is complete, so the saved study keeps its last one.
      const problems = accuracyDesignProblems(accuracyItems(latest.current.data.sheets.accuracy));
      if (problems.length > 0) {
        setState({ kind: 'incomplete', problems });
        return false;
      }
      if (status.current === 'returned') {
        if (!reasonRef.current.trim()) {
          setState({ kind: 'needs-reason' });
          return false;
        }
        changes.reason = reasonRef.current.trim();
      }
      const attempt = (async () => {
        setState({ kind: 'saving' });
        try {
          const study = await mutateAsync(changes);
          lockVersion.current = study.lockVersion;
          status.current = study.status;
          saved.current = {
            title: changes.title ?? saved.current.title,
            meta: changes.meta ? payload.meta : saved.current.meta,
            data: changes.data ? payload.data : saved.current.data,
          };
          setServer(study);
          return true;
        } catch (error) {
          if (isApiError(error) && error.status === 409) {
            stopped.current = true;
            setState({ kind: 'conflict' });
          } else if (isApiError(error)) {
            setState({ kind: 'error', message: error.body.message, details: (error.body.errors ?? []).map((e) => e.message) });
          } else {
            setState({ kind: 'error', message: 'The change could not be saved.', details: [] });
          }
          return false;
        }
      })();
      inFlight.current = attempt;
      const ok = await attempt;
      inFlight.current = null;
      if (!ok) return false;
    }
  }, [mutateAsync]);

  const change = useCallback(
    (updater: (draft: StudyDraft) => StudyDraft) => {
      const next = updater(latest.current);
      latest.current = next;
      setDraft(next);
      if (stopped.current || !mayEdit.current || !isEditable({ status: status.current })) return;
      setState({ kind: 'pending' });
      if (timer.current) clearTimeout(timer.current);
      timer.current = setTimeout(() => void saveNow(), AUTOSAVE_DELAY_MS);
    },
    [saveNow],
  );

  const setReason = useCallback(
    (text: string) => {
      reasonRef.current = text;
      setReasonState(text);
      if (text.trim() && !stopped.current) {
        if (timer.current) clearTimeout(timer.current);
        timer.current = setTimeout(() => void saveNow(), AUTOSAVE_DELAY_MS);
      }
    },
    [saveNow],
  );

  /** Drops local edits and loads the study as the server has it (after a conflict). */
  const reload = useCallback(async () => {
    const study = await queryClient.fetchQuery({ ...studiesQueries.detail(initial.id), staleTime: 0 });
    adopt(study);
  }, [adopt, initial.id, queryClient]);

  /** Saves first, then answers what an import must send; null when the draft could not be saved. */
  const prepareImport = useCallback(async () => {
    const ok = await saveNow();
    if (!ok) return null;
    return { lockVersion: lockVersion.current, ...(status.current === 'returned' ? { reason: reasonRef.current.trim() } : {}) };
  }, [saveNow]);

  const dirty = state.kind === 'pending' || state.kind === 'saving' || state.kind === 'needs-reason' || state.kind === 'incomplete';
  useEffect(() => {
    if (!dirty) return;
    const warn = (event: BeforeUnloadEvent) => event.preventDefault();
    window.addEventListener('beforeunload', warn);
    return () => window.removeEventListener('beforeunload', warn);
  }, [dirty]);

  // Leaving the wizard sends what is still waiting.
  useEffect(
    () => () => {
      if (timer.current) void saveNow();
    },
    [saveNow],
  );

  const data = useMemo(() => draftToData(draft.data), [draft.data]);

  return { draft, data, server, state, editable, lockedReason, reason, setReason, change, saveNow, reload, prepareImport, adopt };
}

export type StudyDraftController = ReturnType<typeof useStudyDraft>;
