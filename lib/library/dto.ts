import { suggestDesign } from '@/lib/citations/design';
import type { EffectDataDTO, StudyDTO, StudyDesign, TrainingStatus } from '@/lib/reviews/types';
import type { StudyRow } from './import-insert';

/** A library row as the routes send it. `appraisalCount` comes from a grouped count the caller ran. */
export function toStudyDTO(study: StudyRow, appraisalCount = 0): StudyDTO {
  return {
    id: study.id,
    teamId: study.teamId,
    csl: study.csl,
    doi: study.doi,
    title: study.title,
    citation: study.citation,
    year: study.year,
    journal: study.journal,
    design: study.design as StudyDesign | null,
    suggestedDesign: study.design ? null : suggestDesign(study.csl),
    population: study.population as TrainingStatus | null,
    injured: study.injured,
    n: study.n,
    intensity: study.intensity,
    durationWeeks: study.durationWeeks,
    outcome: study.outcome,
    effect: study.effect as EffectDataDTO | null,
    tags: study.tags ?? [],
    hasPdf: study.pdfKey !== null,
    createdAt: study.createdAt.toISOString(),
    appraisalCount,
    notice: study.evidenceNotice ?? null,
  };
}
