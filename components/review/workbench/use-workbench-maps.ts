'use client';

import { useMemo } from 'react';
import type { AppraisalDTO, StudyDTO, VerdictDTO, VerdictMechanismDTO, WorkbenchDTO } from '@/lib/reviews/types';

/**
 * The workbench's lookups, rebuilt only when their source changes: mechanisms in text order
 * and by id, every study we know of by id (the team library, the studies the text cites, the
 * review's own), the verdict's row per mechanism, and the appraisals per target (null: the
 * claimed outcome).
 */
export function useWorkbenchMaps(
  data: WorkbenchDTO,
  library: readonly StudyDTO[] | undefined,
  verdict: VerdictDTO | undefined,
) {
  const { mechanisms: unsorted, appraisals } = data;
  const mechanisms = useMemo(() => [...unsorted].sort((a, b) => a.position - b.position || a.id - b.id), [unsorted]);
  const mechanismMap = useMemo(() => new Map(mechanisms.map((m) => [m.id, m])), [mechanisms]);
  const studyMap = useMemo(() => {
    const map = new Map<number, StudyDTO>();
    for (const s of library ?? []) map.set(s.id, s);
    for (const s of data.citedStudies ?? []) map.set(s.id, s);
    for (const s of data.studies) map.set(s.id, s);
    return map;
  }, [library, data.studies, data.citedStudies]);
  const studyList = useMemo(() => [...studyMap.values()], [studyMap]);
  const scores = useMemo(() => {
    const map = new Map<number, VerdictMechanismDTO>();
    for (const m of verdict?.mechanisms ?? []) map.set(Number(m.id), m);
    return map;
  }, [verdict]);
  const byTarget = useMemo(() => {
    const map = new Map<number | null, AppraisalDTO[]>();
    for (const a of appraisals) {
      const list = map.get(a.mechanismId) ?? [];
      list.push(a);
      map.set(a.mechanismId, list);
    }
    return map;
  }, [appraisals]);
  return { mechanisms, mechanismMap, studyMap, studyList, scores, byTarget };
}
