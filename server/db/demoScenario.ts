import type { RateModelContent } from "../../shared/schemas/rateModels.js";
import type { MasterRecordContent } from "../../shared/schemas/masterRecords.js";
import type { VesselInput } from "../../shared/schemas/vessels.js";
import type { BatchPlanInput } from "../../shared/schemas/campaigns.js";

// The invented demo: Harrow Fen pilot plant, campaign HF-24, gas-phase cracking of the dimer
// DMX → 2 MON fed with 30 % nitrogen (εA = 0.7), first order, isobaric at 2.0 bar(a), 250 °C.
// Every name and number here is made up for the demo.

export const DEMO_VESSELS: VesselInput[] = [
  { tag: "HF-BC-02", description: "2 L bench displacement cell (glass burette, water-jacketed)", mawp: { value: 6, unit: "bar(g)" }, reliefSetPressure: { value: 5, unit: "bar(g)" }, minVolume: { value: 0.2, unit: "L" }, maxVolume: { value: 2, unit: "L" }, boreArea: null },
  { tag: "HF-PV-40", description: "40 L pilot piston vessel, 200 mm bore", mawp: { value: 10, unit: "bar(g)" }, reliefSetPressure: { value: 8.5, unit: "bar(g)" }, minVolume: { value: 4, unit: "L" }, maxVolume: { value: 40, unit: "L" }, boreArea: { value: 314.16, unit: "cm²" } },
  { tag: "HF-PV-600", description: "600 L plant piston vessel, 500 mm bore", mawp: { value: 10, unit: "bar(g)" }, reliefSetPressure: { value: 8.5, unit: "bar(g)" }, minVolume: { value: 60, unit: "L" }, maxVolume: { value: 600, unit: "L" }, boreArea: { value: 0.19635, unit: "m²" } },
];

export const DEMO_RATE_MODEL = {
  code: "DMX-CRACK",
  title: "DMX cracking to MON in the gas phase, nitrogen-diluted feed",
  content: {
    reaction: { reactants: [{ species: "DMX", coefficient: 1, phase: "gas" }], products: [{ species: "MON", coefficient: 2, phase: "gas" }] },
    keySpecies: "DMX",
    feed: { DMX: 0.7, N2: 0.3 },
    order: 1,
    kRef: 2.0e-3,
    TRefK: 523.15,
    EaJPerMol: 160_000,
    tolerancePct: 10,
    residualRmsMaxPctOfV0: 1.5,
    temperatureBandK: 2,
    pressureBandPct: 2,
    notes: "Fitted from the HF-22 lab series.",
  } satisfies RateModelContent,
};


const num = (key: string, label: string, unit: string, low: number | null, high: number | null, perLitreV0 = false) => ({ kind: "number" as const, key, label, unit, low, high, perLitreV0, required: true });

export const DEMO_MASTER_RECORD = {
  code: "HF-DMX",
  title: "DMX cracking batch, constant pressure",
  content: {
    maxConversion: 1,
    targetConversion: 0.95,
    yieldLimits: { low: 0.93, high: 1.02 },
    notes: "",
    phases: {
      charge: [
        { key: "reliefCheck", title: "Confirm relief protection", instructions: "Check the relief valve tag and its set pressure against the vessel record. Leak-test the empty vessel with nitrogen.", critical: true, fields: [
          { kind: "choice" as const, key: "reliefStatus", label: "Relief valve", choices: ["In service, tag current", "Not in service"], required: true },
          num("leakTestPressure", "Leak-test pressure", "bar(a)", 2.4, 2.6),
        ] },
        { key: "chargeDmx", title: "Charge DMX", instructions: "Charge DMX from the weighed cylinder into the evacuated vessel.", critical: true, fields: [
          { kind: "text" as const, key: "dmxLot", label: "DMX lot number", required: true },
          num("dmxMass", "DMX charged", "g", 5.3, 5.52, true),
        ] },
        { key: "chargeN2", title: "Charge nitrogen", instructions: "Make up with nitrogen to the feed ratio.", critical: false, fields: [num("n2Mass", "Nitrogen charged", "g", 0.37, 0.4, true)] },
      ],
      run: [
        { key: "pressurise", title: "Pressurise and heat", instructions: "Bring the vessel to 2.0 bar(a) and 250 °C and start the volume logger.", critical: true, fields: [
          num("temperature", "Temperature at start", "°C", 248, 252),
          num("pressure", "Pressure at start", "bar(a)", 1.96, 2.04),
          { kind: "datetime" as const, key: "startedAt", label: "Reaction start", required: true },
        ] },
        { key: "runEnd", title: "End of run", instructions: "Stop heating when the volume has levelled off.", critical: false, fields: [
          { kind: "datetime" as const, key: "endedAt", label: "Run end", required: true },
          num("finalVolume", "Final volume reading", "L", null, null),
        ] },
      ],
      sample: [
        { key: "sampleGas", title: "Take the gas sample", instructions: "Draw the sample into the evacuated bulb and label it.", critical: false, fields: [
          { kind: "text" as const, key: "sampleId", label: "Sample bulb id", required: true },
          { kind: "datetime" as const, key: "sampledAt", label: "Sample time", required: true },
          { kind: "attachment" as const, key: "loggerFile", label: "Volume logger file", required: false },
        ] },
      ],
      release: [
        { key: "releaseChecklist", title: "Release checklist", instructions: "Confirm the gas analysis and the executed record are complete before release.", critical: false, fields: [
          { kind: "choice" as const, key: "analysisReviewed", label: "Gas analysis", choices: ["Reviewed, within specification", "Reviewed, outside specification"], required: true },
          { kind: "text" as const, key: "notes", label: "Notes", required: false },
        ] },
      ],
    },
  } satisfies MasterRecordContent,
};

export const DEMO_MASTER_RECORD_DRAFT: MasterRecordContent = { ...DEMO_MASTER_RECORD.content, targetConversion: 0.97 };

const at = (v0: number, celsius = 250): Omit<BatchPlanInput, "code" | "vesselId"> => ({ v0: { value: v0, unit: "L" }, temperature: { value: celsius, unit: "°C" }, pressure: { value: 2, unit: "bar(a)" } });

export const DEMO_CAMPAIGN = {
  code: "HF-24",
  process: "DMX cracking to MON, scale-up from bench to plant",
  batches: [
    // The bench batches ran at slightly different set points, which the model update uses.
    ...([["HF-24-B1", 248.5], ["HF-24-B2", 250], ["HF-24-B3", 251.5]] as const).map(([code, c]) => ({ code, vesselTag: "HF-BC-02", ...at(1.0, c) })),
    ...["HF-24-P1", "HF-24-P2", "HF-24-P3"].map((code) => ({ code, vesselTag: "HF-PV-40", ...at(22) })),
    ...["HF-24-F1", "HF-24-F2", "HF-24-F3"].map((code) => ({ code, vesselTag: "HF-PV-600", ...at(330) })),
  ],
};

/**
 * How far each demo batch has got. Traces are made from the model with a little noise; the hot
 * pilot batch's jacket ran 6 K over its set point.
 */
export const DEMO_PROGRESS: Record<string, { to: "released" | "running" | "review" | "held"; traceFraction?: number; runHotK?: number; holdReason?: string; deviation?: { title: string; description: string; severity: "minor" | "major" | "critical" } }> = {
  "HF-24-B1": { to: "released" },
  "HF-24-B2": { to: "released" },
  "HF-24-B3": { to: "released" },
  "HF-24-P1": { to: "running", traceFraction: 0.5 },
  "HF-24-P2": { to: "review", runHotK: 6, deviation: { title: "Jacket temperature overshoot", description: "The jacket controller overshot to about 256 °C during the first half of the run.", severity: "major" } },
  "HF-24-P3": { to: "held", holdReason: "Piston seal weeping; waiting for maintenance", deviation: { title: "Piston seal weep", description: "A slight weep at the piston seal was seen after pressurising.", severity: "minor" } },
};

/**
 * The demo's training on master record HF-DMX version 1, in days relative to the seeding day
 * (UTC): everyone who executes the demo batches is current; the second operator's training
 * lapsed a month ago, so the block can be seen on any batch page.
 */
export const DEMO_TRAINING: { email: string; trainedDaysAgo: number; validForDays: number; note: string }[] = [
  { email: "operator@harrowfen.example", trainedDaysAgo: 60, validForDays: 365, note: "HF-DMX walk-through on the 40 L pilot vessel (demo)." },
  { email: "supervisor@harrowfen.example", trainedDaysAgo: 60, validForDays: 365, note: "HF-DMX walk-through and verification duties (demo)." },
  { email: "quality@harrowfen.example", trainedDaysAgo: 45, validForDays: 365, note: "HF-DMX release checklist (demo)." },
  { email: "operator2@harrowfen.example", trainedDaysAgo: 395, validForDays: 364, note: "HF-DMX walk-through on the bench cell (demo); not renewed." },
];
