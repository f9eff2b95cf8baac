import type { ImportContext } from "@/lib/import/types";

/** A small battery and roster, shaped like the demo club's (names invented). */
export const context: ImportContext = {
  squadName: "Academy U18",
  tests: [
    {
      id: 1,
      name: "Countermovement jump",
      unit: "cm",
      direction: "higher",
      trialRule: "best",
      trialsPerSession: 3,
      plausibleMin: 15,
      plausibleMax: 70,
      aliases: [],
    },
    {
      id: 2,
      name: "10 m sprint",
      unit: "s",
      direction: "lower",
      trialRule: "best",
      trialsPerSession: 3,
      plausibleMin: 1.5,
      plausibleMax: 2.6,
      aliases: [],
    },
    {
      id: 4,
      name: "Intermittent recovery run (level 1)",
      unit: "m",
      direction: "higher",
      trialRule: "best",
      trialsPerSession: 1,
      plausibleMin: 200,
      plausibleMax: 3200,
      aliases: [],
    },
    {
      id: 5,
      name: "Back squat 1RM",
      unit: "kg",
      direction: "higher",
      trialRule: "best",
      trialsPerSession: 1,
      plausibleMin: null,
      plausibleMax: null,
      aliases: [],
    },
  ],
  otherTestNames: ["30 m sprint"],
  athletes: [
    { id: 11, name: "Ana Silva", externalId: "NHA001", aliases: [] },
    { id: 12, name: "Ben Okoro", externalId: "NHA002", aliases: [] },
    { id: 13, name: "Sam Lee", externalId: "NHA003", aliases: [] },
    { id: 14, name: "sam lee", externalId: null, aliases: [] },
  ],
};
