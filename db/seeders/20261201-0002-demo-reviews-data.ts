import type { ConcernLevel, DowngradeDomain } from '../../lib/scoring/appraisal-vocabulary';

/**
 * The demo's three claim reviews (the invented demo scenario). Everything is invented: the
 * claims, the studies (./20261201-0002-demo-reviews.ts takes their references from
 * lib/citations/demo-records.ts — a made-up journal, DOIs under the test prefix 10.5555), the
 * people (the demo accounts of ./demo-accounts.ts) and every number. Each review is built so its
 * verdict differs: the pinch-block claim fails the dose check and does not hold up, the cold
 * plunge claim holds up, and the pull-up ladder works but not for the stated reason.
 */

export type DemoStudyMeta = {
  doi: string;
  design: string;
  population: string | null;
  injured?: boolean;
  n: number | null;
  intensity: number | null;
  durationWeeks: number | null;
  outcome: string;
  effect: Record<string, unknown> | null;
  tags: string[];
};

export const DEMO_STUDIES: DemoStudyMeta[] = [
  {
    doi: '10.5555/hjts.2022.0131',
    design: 'randomized',
    population: 'recreational',
    n: 32,
    intensity: 0.3,
    durationWeeks: 3,
    outcome: 'Thumb flexor tendon stiffness (shear-wave elastography), change in kPa',
    effect: { kind: 'means', m1: 2.1, sd1: 6.0, n1: 16, m2: 1.6, sd2: 5.8, n2: 16 },
    tags: ['tendon', 'fingers'],
  },
  {
    doi: '10.5555/hjts.2021.0207',
    design: 'randomized',
    population: 'trained',
    n: 24,
    intensity: 0.8,
    durationWeeks: 12,
    outcome: 'Finger flexor tendon stiffness, change in %',
    effect: { kind: 'means', m1: 14.5, sd1: 7.0, n1: 12, m2: 3.0, sd2: 6.5, n2: 12 },
    tags: ['tendon', 'fingers', 'isometric'],
  },
  {
    doi: '10.5555/hjts.2020.0318',
    design: 'non-randomized',
    population: 'untrained',
    n: 18,
    intensity: 0.3,
    durationWeeks: 1,
    outcome: 'Tendon collagen synthesis 24 h after one loading session',
    effect: null,
    tags: ['tendon', 'collagen'],
  },
  {
    doi: '10.5555/hjts.2023.0402',
    design: 'cohort',
    population: 'recreational',
    n: 60,
    intensity: 0.3,
    durationWeeks: 6,
    outcome: 'Self-rated pinch confidence and pain on loading',
    effect: { kind: 't', t: 1.2, n1: 30, n2: 30 },
    tags: ['fingers', 'pain'],
  },
  {
    doi: '10.5555/hjts.2019.0255',
    design: 'randomized',
    population: 'trained',
    n: 24,
    intensity: 0.8,
    durationWeeks: 12,
    outcome: 'One-repetition maximum back squat, gain in kg (cold plunge vs active recovery)',
    effect: { kind: 'means', m1: 9.5, sd1: 6.0, n1: 12, m2: 14.5, sd2: 6.0, n2: 12 },
    tags: ['recovery', 'strength', 'cold'],
  },
  {
    doi: '10.5555/hjts.2021.0119',
    design: 'randomized',
    population: 'trained',
    n: 20,
    intensity: 0.8,
    durationWeeks: 0.3,
    outcome: 'Myofibrillar protein synthesis over 48 h after a session',
    effect: { kind: 't', t: -2.4, n1: 10, n2: 10 },
    tags: ['recovery', 'cold', 'hypertrophy'],
  },
  {
    doi: '10.5555/hjts.2022.0333',
    design: 'randomized',
    population: 'recreational',
    n: 40,
    intensity: 0.75,
    durationWeeks: 10,
    outcome: 'One-repetition maximum, gain in kg (cold plunge vs none)',
    effect: { kind: 'means', m1: 18, sd1: 9, n1: 20, m2: 22, sd2: 9, n2: 20 },
    tags: ['recovery', 'strength', 'cold'],
  },
  {
    doi: '10.5555/hjts.2023.0210',
    design: 'cohort',
    population: 'trained',
    n: 40,
    intensity: 0.8,
    durationWeeks: 12,
    outcome: 'Responders (1RM gain of 10 % or more), cold plunge vs none',
    effect: { kind: 'two-by-two', a: 7, b: 13, c: 13, d: 7, measure: 'odds-ratio' },
    tags: ['recovery', 'strength', 'cold'],
  },
  {
    doi: '10.5555/hjts.2024.0144',
    design: 'randomized',
    population: 'recreational',
    n: 30,
    intensity: 0.8,
    durationWeeks: 6,
    outcome: 'Lock-off hold at 90° elbow flexion, change in seconds',
    effect: { kind: 'means', m1: 24, sd1: 9, n1: 15, m2: 9, sd2: 9, n2: 15 },
    tags: ['pulling', 'climbing', 'strength'],
  },
  {
    doi: '10.5555/hjts.2020.0421',
    design: 'randomized',
    population: 'recreational',
    n: 28,
    intensity: 0.85,
    durationWeeks: 6,
    outcome: 'Isometric pulling force; elbow flexor and latissimus thickness',
    effect: { kind: 't', t: 2.6, n1: 14, n2: 14 },
    tags: ['pulling', 'strength', 'hypertrophy'],
  },
  {
    doi: '10.5555/hjts.2022.0188',
    design: 'non-randomized',
    population: 'recreational',
    n: 22,
    intensity: 0.7,
    durationWeeks: 5,
    outcome: 'Pulling force at the practised elbow angle vs other angles',
    effect: null,
    tags: ['pulling', 'skill'],
  },
  {
    doi: '10.5555/hjts.2023.0076',
    design: 'cohort',
    population: 'trained',
    n: 35,
    intensity: 0.8,
    durationWeeks: 6,
    outcome: 'Latissimus dorsi thickness (ultrasound), change',
    effect: { kind: 'ready', effectSize: 0.08, variance: 0.06, measure: 'smd' },
    tags: ['pulling', 'hypertrophy'],
  },
  {
    doi: '10.5555/hjts.2021.0290',
    design: 'cross-sectional',
    population: 'recreational',
    n: 40,
    intensity: null,
    durationWeeks: null,
    outcome: 'Test–retest change in isometric pulling force without training',
    effect: null,
    tags: ['testing'],
  },
];

export type DemoMechanism = {
  key: string;
  name: string;
  kind: 'physiological' | 'perceptual' | 'skill' | 'non-specific';
  summary: string;
  minIntensity?: number;
  minEffort?: 'easy' | 'moderate' | 'hard' | 'to-failure';
  prior: number;
  magnitude: 'none' | 'small' | 'moderate' | 'large';
  stated?: boolean;
  /** Which way the mechanism's measure shows it working (docs/scoring.md §10); default 'higher'. */
  desirable?: 'higher' | 'lower';
};

export type DemoAppraisal = Partial<Record<DowngradeDomain, ConcernLevel>> & {
  doi: string;
  /** null: the claimed outcome. */
  mechanism: string | null;
  direction: 'supports' | 'against' | 'neutral';
  doseResponse?: boolean;
  override?: { value: number; reason: string };
  /** Why the direction differs from the one the study's effect suggests. */
  directionReason?: string;
  notes: string;
};

/** Paragraph parts: text, or a citation of a study by DOI. */
export type Inline = string | { cite: string };

export type DemoReview = {
  authorEmail: string;
  title: string;
  claim: string;
  claimSource: string;
  claimUrl: string | null;
  protocol: Record<string, unknown>;
  population: { status: string; injured: boolean };
  /** Which way the claimed outcome's measure is the claimed effect (docs/scoring.md §10); default 'higher'. */
  outcomeDesirable?: 'higher' | 'lower';
  status: string;
  tags: string[];
  mechanisms: DemoMechanism[];
  appraisals: DemoAppraisal[];
  recommendations: { whoMightTry: string; whoShouldNot: string; whatInstead: string };
  intro: Inline[][];
  evidence: Inline[][];
  /** What the verdict code must say; the seed warns and the tests fail when it does not. */
  expectedVerdict: 'insufficient' | 'not-supported' | 'uncertain' | 'supported' | 'other-reasons';
};

export const DEMO_REVIEWS: DemoReview[] = [
  {
    authorEmail: 'coach@granite-hollow.test',
    title: 'Light daily pinch-block lifts for thumb tendons',
    claim: 'Four daily sets of light pinch-block lifts stiffen thumb tendons in three weeks.',
    claimSource: 'A short video on a climbing-tips channel ("Pinch Lab"), repeated in a gym newsletter',
    claimUrl: 'https://video.example.test/pinch-lab/thumb-tendons',
    protocol: {
      exercise: 'Pinch-block lift, wide pinch, 10-second holds',
      loadValue: 30,
      loadUnit: 'percent-max',
      referenceBodyweightKg: null,
      referenceMaxAddedKg: null,
      secondsPerSet: 10,
      setsPerSession: 1,
      sessionsPerDay: 4,
      daysPerWeek: 7,
      minHoursBetween: 3,
      weeks: 3,
      effort: 'easy',
    },
    population: { status: 'recreational', injured: false },
    status: 'in-review',
    tags: ['fingers', 'tendon', 'climbing'],
    mechanisms: [
      {
        key: 'tendon',
        name: 'Tendon stiffening from collagen remodelling',
        kind: 'physiological',
        stated: true,
        summary: 'Repeated loading makes the thumb flexor tendon stiffer by laying down and cross-linking collagen.',
        minIntensity: 0.7,
        minEffort: 'hard',
        prior: 0.4,
        magnitude: 'moderate',
      },
      {
        key: 'neural',
        name: 'Motor learning of the pinch grip',
        kind: 'skill',
        summary:
          'Daily practice improves how the thumb and fingers coordinate on the block, so lifts feel stronger without tissue change.',
        prior: 0.5,
        magnitude: 'small',
      },
      {
        key: 'pain',
        name: 'Less pain and threat around the thumb',
        kind: 'perceptual',
        summary: 'Gentle, predictable loading lowers protective pain and raises confidence in a sore thumb.',
        prior: 0.4,
        magnitude: 'small',
      },
      {
        key: 'expectation',
        name: 'Expectation and attention',
        kind: 'non-specific',
        summary:
          'Believing the drill works, and paying attention to the thumb, changes how strength tests feel and go.',
        prior: 0.5,
        magnitude: 'small',
      },
      {
        key: 'thenar',
        name: 'Growth of the thenar muscles',
        kind: 'physiological',
        summary: 'The thumb’s own muscles grow and pull harder.',
        minIntensity: 0.6,
        minEffort: 'hard',
        prior: 0.3,
        magnitude: 'small',
      },
    ],
    appraisals: [
      {
        doi: '10.5555/hjts.2022.0131',
        mechanism: null,
        direction: 'against',
        imprecision: 'serious',
        directionReason:
          'The interval spans no change, but the estimate is far below the stiffening the claim promises at this exact dose.',
        notes:
          'Same dose and population as the claim; stiffness did not change more than in controls over three weeks.',
      },
      {
        doi: '10.5555/hjts.2021.0207',
        mechanism: null,
        direction: 'neutral',
        indirectness: 'serious',
        directionReason: 'The stiffening is real, but at a heavy twelve-week dose the claim does not use.',
        notes: 'Heavy loading over twelve weeks: says little about light loading over three.',
      },
      {
        doi: '10.5555/hjts.2023.0402',
        mechanism: null,
        direction: 'neutral',
        notes: 'Measured confidence and pain, not stiffness.',
      },
      {
        doi: '10.5555/hjts.2021.0207',
        mechanism: 'tendon',
        direction: 'supports',
        notes: 'Stiffening is real, but at 80 % of maximum and hard effort.',
      },
      {
        doi: '10.5555/hjts.2020.0318',
        mechanism: 'tendon',
        direction: 'against',
        notes: 'Collagen synthesis barely rose after low-intensity loading.',
      },
      {
        doi: '10.5555/hjts.2023.0402',
        mechanism: 'neural',
        direction: 'supports',
        directionReason: 'The technique ratings, a secondary measure, improved clearly; the pooled score did not.',
        notes: 'Pinch technique ratings improved with daily practice.',
      },
      {
        doi: '10.5555/hjts.2023.0402',
        mechanism: 'pain',
        direction: 'supports',
        directionReason:
          'Pain on loading, reported separately, fell; the combined score with confidence did not move clearly.',
        notes: 'Pain on loading fell over six weeks.',
      },
    ],
    recommendations: {
      whoMightTry:
        'Climbers easing back into pinching after a niggle, for confidence and technique — not for tendon change.',
      whoShouldNot: 'Anyone with a painful, swollen or clicking thumb: see a physiotherapist first.',
      whatInstead:
        'For tendon adaptation, fewer and heavier isometric holds (around 70–80 % of maximum, hard effort) two or three times a week.',
    },
    intro: [
      [
        'The claim promises stiffer thumb tendons from four light sets a day. The protocol sits at about 30 % of maximum and easy effort.',
      ],
      [
        'Tendon stiffening in trials came with heavy, hard loading ',
        { cite: '10.5555/hjts.2021.0207' },
        ', which this protocol does not reach.',
      ],
    ],
    evidence: [
      [
        'The one trial of this dose in recreational climbers found no change beyond controls ',
        { cite: '10.5555/hjts.2022.0131' },
        '. Confidence and technique did improve with daily practice ',
        { cite: '10.5555/hjts.2023.0402' },
        '.',
      ],
    ],
    expectedVerdict: 'not-supported',
  },
  {
    authorEmail: 'coach2@granite-hollow.test',
    title: 'Cold plunges after strength sessions',
    claim: 'A cold plunge straight after strength sessions blunts strength gains.',
    claimSource: 'A recovery-gear advertisement and a podcast episode ("Ice Hour")',
    claimUrl: 'https://podcast.example.test/ice-hour/episode-41',
    protocol: {
      exercise:
        'Back squat and bench press, each session followed within 10 minutes by a 10-minute plunge at about 10 °C',
      loadValue: 80,
      loadUnit: 'percent-1rm',
      referenceBodyweightKg: null,
      referenceMaxAddedKg: null,
      secondsPerSet: 30,
      setsPerSession: 5,
      sessionsPerDay: 1,
      daysPerWeek: 3,
      minHoursBetween: 48,
      weeks: 12,
      effort: 'hard',
    },
    population: { status: 'trained', injured: false },
    // The claim is that gains shrink: a smaller gain with the plunge is the claimed effect.
    outcomeDesirable: 'lower',
    status: 'approved',
    tags: ['recovery', 'strength', 'cold'],
    mechanisms: [
      {
        key: 'anabolic',
        name: 'Blunted muscle-building signals after cooling',
        kind: 'physiological',
        desirable: 'lower',
        stated: true,
        summary:
          'Cooling the muscle right after training lowers blood flow and protein synthesis, so less muscle is added.',
        minIntensity: 0.6,
        minEffort: 'hard',
        prior: 0.5,
        magnitude: 'moderate',
      },
      {
        key: 'quality',
        name: 'Poorer next session',
        kind: 'physiological',
        desirable: 'lower',
        summary: 'Residual cooling or stiffness lowers the quality of the next session.',
        prior: 0.3,
        magnitude: 'small',
      },
      {
        key: 'soreness',
        name: 'Less soreness lets athletes train harder',
        kind: 'perceptual',
        summary: 'Would work against the claim: feeling fresher could raise training volume.',
        prior: 0.4,
        magnitude: 'small',
      },
      {
        key: 'expectation',
        name: 'Belief that cold speeds recovery',
        kind: 'non-specific',
        summary: 'Athletes who believe in the plunge may push differently in later sessions.',
        prior: 0.5,
        magnitude: 'small',
      },
    ],
    appraisals: [
      {
        doi: '10.5555/hjts.2019.0255',
        mechanism: null,
        direction: 'supports',
        directionReason: 'Twelve weeks at the claimed dose; the interval only just reaches no difference.',
        notes: 'Smaller 1RM gains with the plunge over twelve weeks.',
      },
      {
        doi: '10.5555/hjts.2022.0333',
        mechanism: null,
        direction: 'supports',
        imprecision: 'serious',
        directionReason: 'Same direction as the longer trial; the width of the interval is counted as imprecision.',
        notes: 'Same direction in recreational lifters; wide interval.',
      },
      {
        doi: '10.5555/hjts.2023.0210',
        mechanism: null,
        direction: 'supports',
        directionReason: 'Half as many responders with the plunge; a small trial, in line with the other two.',
        notes: 'Fewer responders among athletes who plunged.',
      },
      {
        doi: '10.5555/hjts.2021.0119',
        mechanism: 'anabolic',
        direction: 'supports',
        notes: 'Protein synthesis lower for 48 h after cooling.',
      },
      {
        doi: '10.5555/hjts.2019.0255',
        mechanism: 'anabolic',
        direction: 'supports',
        directionReason: 'Judged on muscle thickness, reported beside the strength result, which fell clearly.',
        notes: 'Muscle thickness gains also smaller.',
      },
      {
        doi: '10.5555/hjts.2022.0333',
        mechanism: 'quality',
        direction: 'against',
        imprecision: 'serious',
        directionReason:
          'The effect here is the strength gain; the next-session volume and bar speed it also reports did not differ.',
        notes: 'Session volume and bar speed were the same in both groups.',
      },
      {
        doi: '10.5555/hjts.2023.0210',
        mechanism: 'soreness',
        direction: 'neutral',
        notes: 'Soreness not reported by group.',
      },
    ],
    recommendations: {
      whoMightTry: 'Athletes in a competition block who value feeling fresh over maximal strength gains.',
      whoShouldNot:
        'Anyone building strength or muscle in an off-season block; anyone with cold-related conditions or heart problems — ask a physician.',
      whatInstead:
        'Keep plunges away from strength days (or at least several hours after), and use them around competition.',
    },
    intro: [
      [
        'The claim says a plunge right after lifting holds back strength gains. The protocol is heavy (80 %1RM, hard) three times a week for twelve weeks.',
      ],
    ],
    evidence: [
      [
        'Three studies point the same way ',
        { cite: '10.5555/hjts.2019.0255' },
        ', ',
        { cite: '10.5555/hjts.2022.0333' },
        ', and fewer athletes responded to the block when they plunged ',
        { cite: '10.5555/hjts.2023.0210' },
        '.',
      ],
      [
        'The stated mechanism has direct support: lower protein synthesis after cooling ',
        { cite: '10.5555/hjts.2021.0119' },
        '.',
      ],
    ],
    expectedVerdict: 'supported',
  },
  {
    authorEmail: 'owner@granite-hollow.test',
    title: 'Weighted pull-up ladder for lock-off strength',
    claim: 'A weighted pull-up ladder makes lock-offs much stronger in six weeks by building back muscle.',
    claimSource: 'A training-app challenge ("Ladder Six") shared in a climbing forum',
    claimUrl: 'https://forum.example.test/threads/ladder-six',
    protocol: {
      exercise: 'Weighted pull-up ladder (1-2-3 reps, repeated)',
      loadValue: 15,
      loadUnit: 'kg-added',
      referenceBodyweightKg: 70,
      referenceMaxAddedKg: 35,
      secondsPerSet: 20,
      setsPerSession: 5,
      sessionsPerDay: 1,
      daysPerWeek: 3,
      minHoursBetween: 48,
      weeks: 6,
      effort: 'hard',
    },
    population: { status: 'recreational', injured: false },
    status: 'draft',
    tags: ['pulling', 'climbing', 'strength'],
    mechanisms: [
      {
        key: 'hypertrophy',
        name: 'Growth of the lats and elbow flexors',
        kind: 'physiological',
        stated: true,
        summary: 'More muscle in the pulling muscles makes the lock-off stronger.',
        minIntensity: 0.65,
        minEffort: 'hard',
        prior: 0.35,
        magnitude: 'small',
      },
      {
        key: 'neural',
        name: 'Neural drive and coordination of the pullers',
        kind: 'physiological',
        summary: 'Heavy pulling teaches the nervous system to recruit and time the pulling muscles better.',
        minIntensity: 0.7,
        minEffort: 'hard',
        prior: 0.55,
        magnitude: 'large',
      },
      {
        key: 'skill',
        name: 'Position-specific skill from practising lock-offs',
        kind: 'skill',
        summary: 'Holding the top of each rep trains strength at exactly the joint angle tested.',
        prior: 0.5,
        magnitude: 'moderate',
      },
      {
        key: 'familiarisation',
        name: 'Learning the test itself',
        kind: 'non-specific',
        summary: 'Repeating the lock-off test improves scores without any training.',
        prior: 0.5,
        magnitude: 'small',
      },
      {
        key: 'connective',
        name: 'Connective-tissue remodelling',
        kind: 'physiological',
        summary: 'Tendons and fascia of the pulling chain stiffen and transmit force better.',
        minIntensity: 0.8,
        minEffort: 'hard',
        prior: 0.25,
        magnitude: 'small',
      },
    ],
    appraisals: [
      {
        doi: '10.5555/hjts.2024.0144',
        mechanism: null,
        direction: 'supports',
        notes: 'Clear gain in lock-off hold time after six weeks.',
      },
      {
        doi: '10.5555/hjts.2020.0421',
        mechanism: null,
        direction: 'supports',
        riskOfBias: 'serious',
        notes: 'Pulling force rose; assessors were not blinded.',
      },
      {
        doi: '10.5555/hjts.2020.0421',
        mechanism: 'hypertrophy',
        direction: 'against',
        riskOfBias: 'serious',
        directionReason:
          'The effect recorded is pulling force; muscle thickness, the measure of this mechanism, did not change.',
        notes: 'No change in muscle thickness over six weeks.',
      },
      {
        doi: '10.5555/hjts.2023.0076',
        mechanism: 'hypertrophy',
        direction: 'against',
        directionReason: 'A near-zero change measured precisely enough to rule out the growth the claim needs.',
        notes: 'Latissimus thickness unchanged in trained climbers.',
      },
      {
        doi: '10.5555/hjts.2024.0144',
        mechanism: 'neural',
        direction: 'supports',
        notes: 'Gains far beyond any change in muscle size.',
      },
      {
        doi: '10.5555/hjts.2020.0421',
        mechanism: 'neural',
        direction: 'supports',
        riskOfBias: 'serious',
        notes: 'Strength rose early, before muscle could grow.',
      },
      {
        doi: '10.5555/hjts.2022.0188',
        mechanism: 'skill',
        direction: 'supports',
        doseResponse: true,
        notes: 'Gains largest at the practised angle, more with more practice.',
      },
      {
        doi: '10.5555/hjts.2021.0290',
        mechanism: 'familiarisation',
        direction: 'supports',
        override: {
          value: 0.6,
          reason: 'A test–retest study, not a training study: only partly speaks to a six-week block.',
        },
        notes: 'Scores rose on retest alone.',
      },
    ],
    recommendations: {
      whoMightTry:
        'Recreational climbers with healthy elbows and shoulders who want stronger lock-offs within a season.',
      whoShouldNot:
        'Anyone with elbow or shoulder pain, or within a year of a finger or elbow injury, without clearance from a physiotherapist.',
      whatInstead:
        'Expect strength from better recruitment and practice of the position; for muscle, plan longer blocks with more volume.',
    },
    intro: [
      [
        'The ladder is heavy (+15 kg for a 70 kg climber whose maximum is +35 kg, about 0.81 of maximum) and hard, three times a week.',
      ],
    ],
    evidence: [
      [
        'Lock-offs do get stronger ',
        { cite: '10.5555/hjts.2024.0144' },
        ', but six weeks is too short for muscle growth to explain it ',
        { cite: '10.5555/hjts.2020.0421' },
        '; better recruitment and position practice are the likelier reasons ',
        { cite: '10.5555/hjts.2022.0188' },
        '.',
      ],
    ],
    expectedVerdict: 'other-reasons',
  },
];
