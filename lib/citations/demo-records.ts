import type { CslItem } from './csl';

/**
 * Invented references for the demo and the tests: no real study, author or journal. The
 * journal ("Hollowridge Journal of Training Science") is made up and every DOI uses the test
 * prefix 10.5555. The local DOI fake (./fake-doi-server.ts) answers these as CSL-JSON, and the
 * demo seed (db/seeders/20261201-0002-demo-reviews.ts) puts the first thirteen in the demo
 * team's library; the last three are only in the fake, so a coach trying "add by DOI" in
 * `npm run dev` gets new studies.
 */

export const DEMO_JOURNAL = 'Hollowridge Journal of Training Science';

const article = (
  doi: string,
  authors: [string, string][],
  year: number,
  title: string,
  volume: number,
  issue: number,
  page: string,
): CslItem => ({
  type: 'article-journal',
  DOI: doi,
  title,
  author: authors.map(([family, given]) => ({ family, given })),
  issued: { 'date-parts': [[year]] },
  'container-title': DEMO_JOURNAL,
  volume: String(volume),
  issue: String(issue),
  page,
});

export const DEMO_REFERENCES: CslItem[] = [
  // Pinch-block claim
  article(
    '10.5555/hjts.2022.0131',
    [
      ['Brankov', 'Aldous'],
      ['Talloway', 'Renske'],
    ],
    2022,
    'Low-load daily isometric pinch holds and thumb tendon stiffness: A randomized trial',
    10,
    1,
    '31-44',
  ),
  article(
    '10.5555/hjts.2021.0207',
    [
      ['Quenby', 'Mirela'],
      ['Vindahl', 'Oskar'],
      ['Ashgrove', 'Femi'],
    ],
    2021,
    'Heavy slow isometric loading increases finger flexor tendon stiffness in trained climbers',
    9,
    2,
    '107-121',
  ),
  article(
    '10.5555/hjts.2020.0318',
    [
      ['Vindahl', 'Oskar'],
      ['Ashgrove', 'Femi'],
    ],
    2020,
    'Tendon collagen synthesis after low- and high-intensity loading: A microdialysis study',
    8,
    3,
    '180-192',
  ),
  article(
    '10.5555/hjts.2023.0402',
    [
      ['Pennard', 'Lucia'],
      ['Keswick', 'Dario'],
      ['Talloway', 'Renske'],
    ],
    2023,
    'Daily finger training and pinch confidence in recreational climbers: A cohort study',
    11,
    4,
    '402-413',
  ),
  // Cold-plunge claim
  article(
    '10.5555/hjts.2019.0255',
    [
      ['Strathmore', 'Hana'],
      ['Keswick', 'Dario'],
    ],
    2019,
    'Cold-water immersion after resistance exercise attenuates strength and muscle gains over 12 weeks',
    7,
    2,
    '55-69',
  ),
  article(
    '10.5555/hjts.2021.0119',
    [
      ['Marrow', 'Ines'],
      ['Lisk', 'Teodor'],
      ['Strathmore', 'Hana'],
    ],
    2021,
    'Post-exercise cooling and muscle protein synthesis in trained men and women',
    9,
    1,
    '19-30',
  ),
  article(
    '10.5555/hjts.2022.0333',
    [
      ['Lisk', 'Teodor'],
      ['Ormond', 'Kaja'],
    ],
    2022,
    'Cold plunges and one-repetition maximum gains across a ten-week training block',
    10,
    3,
    '333-345',
  ),
  article(
    '10.5555/hjts.2023.0210',
    [
      ['Hollis', 'Greta'],
      ['Ashgrove', 'Femi'],
    ],
    2023,
    'Responders to a strength block with and without post-session cold-water immersion',
    11,
    2,
    '210-219',
  ),
  // Pull-up ladder claim
  article(
    '10.5555/hjts.2024.0144',
    [
      ['Ormond', 'Kaja'],
      ['Telford', 'Yusuf'],
      ['Brankov', 'Aldous'],
    ],
    2024,
    'Weighted pull-up training and lock-off strength in recreational climbers: A randomized trial',
    12,
    1,
    '44-57',
  ),
  article(
    '10.5555/hjts.2020.0421',
    [
      ['Telford', 'Yusuf'],
      ['Hollis', 'Greta'],
    ],
    2020,
    'Early strength gains without muscle growth: Six weeks of heavy pulling in novice climbers',
    8,
    4,
    '421-433',
  ),
  article(
    '10.5555/hjts.2022.0188',
    [['Keswick', 'Dario']],
    2022,
    'Lock-off practice and joint-angle-specific pulling strength',
    10,
    2,
    '188-197',
  ),
  article(
    '10.5555/hjts.2023.0076',
    [
      ['Ashgrove', 'Femi'],
      ['Pennard', 'Lucia'],
    ],
    2023,
    'Latissimus dorsi thickness after six weeks of weighted pull-ups in trained climbers',
    11,
    1,
    '76-85',
  ),
  article(
    '10.5555/hjts.2021.0290',
    [
      ['Talloway', 'Renske'],
      ['Marrow', 'Ines'],
    ],
    2021,
    'Familiarisation effects in isometric pulling tests: A test–retest study',
    9,
    3,
    '290-298',
  ),
  // Only in the DOI fake: for trying "add by DOI" on the demo.
  article(
    '10.5555/hjts.2025.0012',
    [['Vindahl', 'Oskar']],
    2025,
    'Hangboard protocols and finger strength in youth climbers: A randomized trial',
    13,
    1,
    '12-25',
  ),
  article(
    '10.5555/hjts.2025.0150',
    [
      ['Ormond', 'Kaja'],
      ['Lisk', 'Teodor'],
    ],
    2025,
    'Session spacing and tendon adaptation to repeated daily loading',
    13,
    2,
    '150-161',
  ),
  article(
    '10.5555/hjts.2024.0377',
    [['Quenby', 'Mirela']],
    2024,
    'Sleep restriction and grip endurance in boulderers',
    12,
    3,
    '377-386',
  ),
];

/** The references the demo seed puts in the library (all but the last three). */
export const SEEDED_REFERENCES = DEMO_REFERENCES.slice(0, 13);

export const demoReference = (doi: string): CslItem | undefined =>
  DEMO_REFERENCES.find((r) => r.DOI === doi.toLowerCase());
