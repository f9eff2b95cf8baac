/**
 * The demo club. Every name, date and number here is invented for Changewise;
 * the noise levels only echo the published ranges in METHODS.md §7
 * (CMJ CV about 3 %, short sprints about 1–1.5 %, intermittent run about 5 %, 1RM about 3 %).
 */
import type { Direction, TrialRule } from "../lib/domain";
import { mulberry32 } from "./seeded-random";

export const DEMO_PASSWORD = "changewise-demo";

export type DemoTest = {
  key: string;
  name: string;
  unit: string;
  decimals: number;
  direction: Direction;
  trialRule: TrialRule;
  trials: number;
  /** Squad mean and between-athlete SD at baseline. */
  mean: number;
  sd: number;
  /** Trial-to-trial noise as a fraction of the score. */
  cv: number;
  /** Mean true change over the block (in the unit; sign as measured) and its SD across athletes. */
  blockChange: number;
  blockChangeSd: number;
  plausible: [number, number];
  typicalError?: { value: number; df: number; source: string };
  /** Other names files use for the test (the Test library's "Other names in files"). */
  aliases?: string[];
};

export const DEMO_TESTS: DemoTest[] = [
  {
    key: "cmj",
    name: "Countermovement jump",
    unit: "cm",
    decimals: 1,
    direction: "higher",
    trialRule: "best",
    trials: 3,
    mean: 34,
    sd: 4.5,
    cv: 0.03,
    blockChange: 1.8,
    blockChangeSd: 1.4,
    plausible: [15, 70],
    aliases: ["CMJ"],
  },
  {
    key: "sprint10",
    name: "10 m sprint",
    unit: "s",
    decimals: 2,
    direction: "lower",
    trialRule: "best",
    trials: 3,
    mean: 1.86,
    sd: 0.07,
    cv: 0.012,
    blockChange: -0.03,
    blockChangeSd: 0.025,
    plausible: [1.5, 2.6],
  },
  {
    key: "sprint30",
    name: "30 m sprint",
    unit: "s",
    decimals: 2,
    direction: "lower",
    trialRule: "best",
    trials: 3,
    mean: 4.52,
    sd: 0.16,
    cv: 0.01,
    blockChange: -0.05,
    blockChangeSd: 0.04,
    plausible: [3.6, 5.6],
    typicalError: { value: 0.045, df: 24, source: "Club test–retest, pre-season 2025 (invented demo value)" },
  },
  {
    key: "ir1",
    name: "Intermittent recovery run (level 1)",
    unit: "m",
    decimals: 0,
    direction: "higher",
    trialRule: "best",
    trials: 1,
    mean: 1480,
    sd: 260,
    cv: 0.05,
    blockChange: 160,
    blockChangeSd: 120,
    plausible: [200, 3200],
    typicalError: { value: 72, df: 16, source: "Published test–retest CV about 5 % (Krustrup et al. 2003)" },
  },
  {
    key: "squat",
    name: "Back squat 1RM",
    unit: "kg",
    decimals: 1,
    direction: "higher",
    trialRule: "best",
    trials: 1,
    mean: 82,
    sd: 14,
    cv: 0.03,
    blockChange: 4,
    blockChangeSd: 3,
    plausible: [20, 250],
  },
];

export const DEMO_ORG = "Northfield Harriers & Rovers Performance Unit";
export const OTHER_ORG = "Kestrel Bay Rowing Academy";

export const SENIOR_SQUAD = {
  name: "Senior Women",
  sport: "Football",
  athletes: [
    "Maren Oduya",
    "Tessa Lindqvist",
    "Ada Brennan-Okafor",
    "Lucía Harrow",
    "Femi Castellane",
    "Noor Balfour",
    "Ingrid Maalouf",
    "Keira Solberg",
    "Priya Damaschke",
    "Orla Venkatesan",
    "Sadie Kowalczuk",
    "Yuki Ferreira",
    "Beatriz Holloway",
    "Dagny Achterberg",
    "Rosa Tembo",
    "Hanne Quigley",
    "Amara Stroud",
    "Clío Nakashima",
  ],
  positions: [
    "GK",
    "DF",
    "DF",
    "DF",
    "DF",
    "MF",
    "MF",
    "MF",
    "MF",
    "FW",
    "FW",
    "FW",
    "DF",
    "MF",
    "FW",
    "GK",
    "MF",
    "DF",
  ],
};

export const ACADEMY_SQUAD = {
  name: "Academy U18",
  sport: "Football",
  athletes: [
    "Jonah Pellegrini",
    "Callum Adeyemi",
    "Rafael Strand",
    "Eli Mbeki-Novak",
    "Theo Varga",
    "Kwame Lindholm",
    "Sami Okonkwo",
    "Luca Dempsey",
    "Idris Haverkamp",
    "Mateo Rusk",
    "Oskar Nwosu",
    "Finn Castell",
  ],
  positions: ["GK", "DF", "DF", "DF", "MF", "MF", "MF", "MF", "FW", "FW", "FW", "DF"],
};

export const OTHER_SQUAD = {
  name: "Junior Sculling",
  sport: "Rowing",
  athletes: ["Wren Abernathy", "Isla Montague", "Petra Volkova", "June Okafor", "Saoirse Lund", "Mila Fairbairn"],
};

/** Small deterministic generator (mulberry32) so the demo is the same on every machine. */
export function seededRandom(seed: number) {
  const uniform = mulberry32(seed);
  const normal = () => {
    const u = Math.max(uniform(), 1e-12);
    return Math.sqrt(-2 * Math.log(u)) * Math.cos(2 * Math.PI * uniform());
  };
  return { uniform, normal };
}

export function roundTo(value: number, decimals: number) {
  const f = 10 ** decimals;
  return Math.round(value * f) / f;
}
