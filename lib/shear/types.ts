/**
 * Types of the shear core. Plain TypeScript, no runtime code.
 *
 * Canonical units inside the core: millimetres (mm), megapascals (MPa),
 * kilonewtons (kN), seconds (s), degrees for angles. Field names carry their
 * unit (`…Mm`, `…Mpa`, `…Kn`) wherever a value is canonical. Reports returned
 * to callers are in the caller's units and say which unit they use.
 */

/** Length unit of a cut program. */
export type LengthUnit = "in" | "mm";
/** Strength unit shown to a caller: ksi for inch programs, MPa for millimetre programs. */
export type StrengthUnit = "ksi" | "MPa";
/** Force unit shown to a caller: short tons-force for inch programs, kN for millimetre programs. */
export type ForceUnit = "tonf" | "kN";
/** Area unit shown to a caller. */
export type AreaUnit = "in2" | "mm2";

export type GradeFamily = "carbon-steel" | "hsla-steel" | "stainless" | "aluminium" | "copper" | "abrasion-resistant";

/**
 * Gauge systems:
 * - `msg`: Manufacturers' Standard Gauge for sheet steel (carbon steel sheet)
 * - `galvanized`: galvanized sheet gauge (MSG weight plus zinc coating)
 * - `ussg`: US Standard Gauge for sheet and plate iron and steel (Act of 3 March 1893), used for stainless
 * - `awg`: American Wire Gauge / Brown & Sharpe, used for aluminium sheet
 */
export type GaugeFamily = "msg" | "galvanized" | "ussg" | "awg";

export type Severity = "error" | "warning";
export type Validation = "pass" | "warn" | "fail";

// ---------------------------------------------------------------------------
// The cut program (input contract)
// ---------------------------------------------------------------------------

/** Thickness as a number in the program's units, or as a gauge number of the grade's gauge system. */
export type ThicknessInput = { value: number } | { gauge: number };

/** One cut group: `count` strokes at one backgauge setting. */
export interface CutGroup {
  /** Backgauge distance = width of each piece cut off, in the program's units. */
  backgauge: number;
  /** Number of strokes at this setting (per workpiece the group runs on). */
  count: number;
  /** Length of cut in the program's units; defaults to the presented edge. Shorter = partial stroke. */
  length?: number;
  /** Take every piece of the previous group (or of group `from`), turned 90°, and run this group on each. */
  turn?: boolean;
  /** With `turn`: the 0-based index of the earlier group whose pieces this group takes; default the group just before. */
  from?: number;
  /** The pieces of this group are offcut (a trim cut). */
  scrap?: boolean;
  note?: string;
}

/** Setup values the program fixes itself; each one overrides the computed value and is still checked. */
export interface SetupOverrides {
  rakeDeg?: number;
  bladeGapMm?: number;
  bladeGapIn?: number;
  /** Hold-down as a percentage of the machine's full hold-down force. */
  holdDownPct?: number;
  crownMm?: number;
  crownIn?: number;
  backgaugeRetractMm?: number;
  backgaugeRetractIn?: number;
}

export interface StockSheet {
  /** Edge presented to the blade. */
  length: number;
  /** Dimension running toward the backgauge. */
  width: number;
  /** Number of sheets; every sheet runs the same program. */
  count: number;
}

export interface CutProgram {
  reference?: string;
  title?: string;
  /** Shear id (resolved by the caller into a ShearProfile). */
  shear?: string;
  /** Grade code (resolved by the caller into a GradeProfile). */
  grade: string;
  thickness: ThicknessInput;
  units: LengthUnit;
  sheet: StockSheet;
  cuts: CutGroup[];
  setup?: SetupOverrides;
  priority?: number;
  dueAt?: string;
  metadata?: Record<string, string>;
}

// ---------------------------------------------------------------------------
// Context: the shear and the grade (mapped from the catalogue by the caller)
// ---------------------------------------------------------------------------

/** A shear as the core needs it. All canonical units. */
export interface ShearProfile {
  id?: string;
  name?: string;
  /** Thickness the maker rates the shear for (at `ratedTensileMpa` and `ratedRakeDeg`). */
  ratedThicknessMm: number;
  /** Tensile strength of the rating material (mild steel is usually rated at 60 ksi ≈ 414 MPa). */
  ratedTensileMpa: number;
  /** Rake at which the rating applies. */
  ratedRakeDeg: number;
  bladeLengthMm: number;
  backgaugeMinMm: number;
  backgaugeMaxMm: number;
  rakeMinDeg: number;
  rakeMaxDeg: number;
  gapMinMm: number;
  gapMaxMm: number;
  /** Strokes per minute at full stroke. */
  strokesPerMin: number;
  /** Hardest material the blades are made for, HB. Null or absent: not checked. */
  maxBladeHardnessHb?: number | null;
  backgaugeSpeedMmPerS: number;
  handlingSecondsPerTurn: number;
  handlingSecondsPerSheet: number;
  /** Explicit maximum thickness per grade code; wins over the force model. */
  gradeThicknessLimitsMm?: Record<string, number>;
  /** Force-proportional part of the crown (centre gap tighter than the ends) at full rated force. Default: DEFAULT_CROWN_AT_RATED_MM. */
  crownAtRatedMm?: number;
  /** The backgauge's stated repeatability (±, mm): the finest difference between settings it holds. Default: REMNANT_TOLERANCE_MM for the piece flow, no repeatability check. */
  backgaugeRepeatabilityMm?: number;
  /** Ends-minus-centre gap with no load (blade and seat straightness, the beam's geometry). Default: DEFAULT_CROWN_BASELINE_MM. */
  crownBaselineMm?: number;
}

/** A material grade as the core needs it. All canonical units. */
export interface GradeProfile {
  code: string;
  name?: string;
  family: GradeFamily;
  /** Standard the values come from, named (e.g. "ASTM A36/A36M"), or why there is none. */
  standard: string;
  /** Yield strength: the standard's minimum, or a typical value when `valuesAreTypical`. */
  yieldMpa: number | null;
  /** Minimum tensile strength from the standard. */
  tensileMinMpa: number | null;
  /** Typical tensile strength, used when the standard gives no minimum. */
  tensileTypicalMpa: number | null;
  /** Upper end of the tensile range where the standard gives one (information only). */
  tensileMaxMpa?: number | null;
  /** True when the strength values are typical values rather than specified minimums. */
  valuesAreTypical: boolean;
  /** Shear strength / tensile strength, used for the straight-blade force. */
  shearTensileRatio: number;
  gaugeFamily: GaugeFamily | null;
  /** Highest hardness to expect, HB; null when the grade states none. */
  hardnessHb: number | null;
  note?: string;
}

export interface CheckContext {
  shear: ShearProfile | null | undefined;
  /** The catalogue entry for `program.grade`; null/absent when the catalogue has none. */
  grade?: GradeProfile | null;
}

// ---------------------------------------------------------------------------
// Findings
// ---------------------------------------------------------------------------

export type FindingCode =
  | "units_inconsistent"
  | "units_suspect"
  | "value_invalid"
  | "shear_unknown"
  | "grade_unknown"
  | "grade_incomplete"
  | "gauge_unknown"
  | "thickness_over_capacity"
  | "force_over_rating"
  | "force_dull_blade_margin"
  | "hardness_over_blade_limit"
  | "cut_length_over_blade"
  | "cut_length_over_workpiece"
  | "partial_stroke"
  | "backgauge_out_of_travel"
  | "backgauge_beyond_workpiece"
  | "group_cuts_nothing"
  | "program_cuts_nothing"
  | "gap_out_of_range"
  | "rake_out_of_range"
  | "strip_narrow"
  | "backgauge_finer_than_repeatability"
  | "strip_distortion";

export interface Finding {
  code: FindingCode;
  severity: Severity;
  /** Plain words, in the caller's units. */
  message: string;
  /** JSON pointer (RFC 6901) into the submitted program. */
  pointer: string;
  limit: number | null;
  actual: number | null;
  unit: string | null;
}
