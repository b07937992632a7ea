// What a process family brings to the app: its bath templates and analysis methods, how a line
// on it is priced, what a run records, which quality records a lot needs before its certificate,
// and the words the certificate uses. Each family is one folder beside this file, registered once
// in ./index.ts; the rest of the app asks the registry rather than testing the family by name.
import type { z } from 'zod';
import type { ProcessFamilyId } from '@/db/types';
import type { CautionKind } from '@/components/ui/caution';
import type { Hazard } from '@/lib/bath/hazards';
import type { BathTemplate } from '@/lib/bath/templates/types';
import type { AnalysisMethod } from '@/lib/bath/methods/titration';
import type { FamilyFigure, LinePrice, PricingInput } from '@/lib/quotes/pricing';

export type { ProcessFamilyId };

/** A quality record a lot of this family needs, and what it says when it is missing or failing. */
export type QualityRequirement = {
  kind: 'thickness' | 'bake' | 'seal_test' | 'phosphorus_content' | 'passivation_lot' | 'passivation_test' | 'salt_spray';
  label: string;
  /** The trade's methods a record of this kind may name. */
  methods?: readonly { id: string; label: string }[];
};

/** One of the family's own fields on the finish form; values arrive in the user's units. */
export type FamilyFormField = {
  /** The key in the family's params (the form field is named fp_<name>). */
  name: string;
  label: string;
  kind: 'number' | 'select';
  options?: readonly { value: string; label: string }[];
  /** Converted from the form's own unit: a thickness per hour, or a temperature. */
  convert?: 'thicknessPerHour' | 'temperature' | 'dollars';
  /** A fixed unit shown beside the box. */
  unit?: string;
  hint?: string;
  optional?: boolean;
};

/** A run as the plater logs it, in storage units; current-free families leave ampHours null. */
export type FamilyRunInput = {
  ampHours: number | null;
  minutesPerLoad: number;
  loads: number;
  partsPerLoad: number;
  areaPerPartDm2: number;
  finish: { element: string; ionCharge: number; distributionRatio: number; minThicknessUm: number };
  tank: { efficiency: number | null; settings: Record<string, unknown> };
  /** Bath conditions read at the tank (temperature, acid concentration), where the family asks. */
  conditions: { temperatureC?: number; concentration?: number };
  /** The shop's own data for the family (lib/families/shop-data), e.g. its passivation windows. */
  familyData?: Record<string, unknown>;
};

/** What the run should have done, shown before saving and stored with it. */
export type FamilyRunPrediction = {
  platedAreaDm2: number;
  averageThicknessUm: number;
  minimumThicknessUm: number;
  requiredMinimumUm: number;
  isBelowMinimum: boolean;
  /** Rules of the process window the run broke, in plain words (passivation); empty when inside. */
  outsideWindow: string[];
};

/** One input of a family's workbench calculator; a quantity is typed in the user's units, stored in SI. */
export type CalculatorInput = {
  name: string;
  label: string;
  kind: 'number' | 'select';
  quantity?: 'area' | 'thickness' | 'currentDensity' | 'temperature' | 'volume';
  /** The quantity per hour (a rate): typed in the reader's unit of it, per hour. */
  perHour?: boolean;
  unit?: string;
  options?: readonly { value: string; label: string }[];
  /** The starting value, in storage units. */
  initial: number | string;
  hint?: string;
};

/** The workbench's quick calculation for a family: what an estimator checks before pricing. */
export type FamilyCalculator = {
  title: string;
  inputs: readonly CalculatorInput[];
  compute(values: Record<string, number | string>, familyData?: Record<string, unknown>): { figures: FamilyFigure[]; notes: string[] };
};

/** A logged run as job costing sees it, in storage units. */
export type RunCostInput = {
  areaDm2: number;
  ampHours: number | null;
  predictedThicknessUm: number;
  tankEfficiency: number | null;
  tank: { volumeL: number; settings: Record<string, unknown> };
  finish: { element: string; ionCharge: number };
};

/** What a run really used: the metal deposited, and for a bath with a life in metal turnovers, the share of it. */
export type RunCost = { metalG: number; bathLife?: { metalTurnovers: number; costPerMtoCents: number } };

export type ProcessFamily<P = Record<string, unknown>> = {
  id: ProcessFamilyId;
  label: string;
  /** The metal the finish is about when the family fixes it (null: the estimator picks one). */
  metal: { element: string; charge: number; label: string } | null;
  /** The thickness method a reading starts from (ASTM B499 magnetic, B244 eddy current, B568 X-ray). */
  thicknessMethod: 'B499' | 'B244' | 'B568' | null;
  /** Whether the process leaves a coating with a thickness (passivation does not). */
  makesCoating: boolean;
  /** Whether the finish carries a current density (and a cathode efficiency, for plating). */
  usesCurrentDensity: boolean;
  usesEfficiency: boolean;
  form: readonly FamilyFormField[];
  /** What a tank of this family keeps besides its chemistry (make-up nickel, end of life, a measured constant). */
  tankSettings: { schema: z.ZodType<Record<string, unknown>>; fields: readonly FamilyFormField[] } | null;
  /** The workbench's calculators for this family (zinc life sits with electroplating). */
  calculators: readonly FamilyCalculator[];
  /** What the finish form calls the heat treatment after the process. */
  bakeLabel: string;
  /** One line on what the family does, for menus and the finish form. */
  summary: string;
  /** The finish's own figures, stored in finishes.family_params. */
  paramsSchema: z.ZodType<P>;
  defaultParams: P;
  templates: readonly BathTemplate[];
  methods: readonly AnalysisMethod[];
  hazards: readonly Hazard[];
  /** The cautions a screen about this finish shows (the seal or treatment can add some). */
  cautions(params: P): CautionKind[];
  /** Whether a tank can run a finish of this family (its bath template, and the metal or treatment). */
  tankServes(tank: { templateId: string; element: string | null; ionCharge: number | null }, finish: { element: string; ionCharge: number; params: P }): boolean;
  /** Whether a run on this family passes current (amp-hours) or only time in the bath. */
  runsWithCurrent: boolean;
  /** The bath conditions a run records at the tank, besides time. */
  runConditions: readonly ('temperatureC' | 'concentration')[];
  predictRun(input: FamilyRunInput, params: P): FamilyRunPrediction;
  /** The run's actual metal and bath use, for job costing. */
  runCost(input: RunCostInput, params: P): RunCost;
  price(input: PricingInput, params: P): LinePrice;
  quality: readonly QualityRequirement[];
  /** What the certificate says was done, in the trade's words. */
  certificateStatement(finish: { name: string; specText: string; minThicknessUm: number }, params: P): string;
};
