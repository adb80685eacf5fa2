/**
 * The master problem in a persistent HiGHS model (maximisation throughout):
 *
 *     Σ_ℓ λ_iℓ = 1                        crew row i (one line each; a reserve line is a column too)
 *     Σ_iℓ a_pℓ λ_iℓ + u_p = d_p           cover row p (u_p ≥ 0 open positions)
 *     min ≤ Σ_i λ_i,reserve ≤ max          reserve row, when the settings bound it
 *     Σ_p c_p u_p ≤ U*                     coverage row (phase 2)
 *     Σ_ℓ σ_iℓ λ_iℓ + f_i ≥ φ              fairness row i (phase 2 with a floor; f_i ≥ 0 penalised)

 * Strict seniority settles crew member i at a score S*_i by bounding every
 * column of i scoring below S*_i − ε at 0 (`settle`): with one line each, that
 * is the floor Σ_ℓ s_iℓ λ_iℓ ≥ S*_i − ε for integer solutions, and a tighter LP
 * than the floor row (which lets a high and a low line mix), keeping the
 * master a set-partitioning problem.
 *
 * Columns are appended as they are generated; rows keep their order, so the
 * duals of one solve price the next round. HiGHS reports, for a maximisation,
 * the reduced profit of a column as c − Σ_r y_r a_r with y the row duals.
 */
import highsLoader, { type Highs, type Model } from "highs";
import { AppError } from "../domain/index.ts";

let loading: Promise<Highs> | undefined;

/** The HiGHS runtime of this thread (one per worker thread: WebAssembly memory never shrinks). */
export function loadHighs(): Promise<Highs> {
  loading ??= highsLoader();
  return loading;
}

export interface MasterColumn {
  crew: number;
  /** pairing indices; empty for a reserve line and for an empty line-holder line */
  pairings: number[];
  reserve: boolean;
  score: number;
}

export interface SolveOutcome {
  /** "target": a MIP stopped at an incumbent reaching its objective target (solveMip's `target`) */
  status: "optimal" | "time-limit" | "interrupted" | "infeasible" | "target" | "other";
  objective: number;
  /** the MIP's dual bound (MIP solves) */
  bound?: number;
}

export class Master {
  readonly columns: MasterColumn[] = [];
  private readonly keys = new Set<string>();
  /** column index in the model of each master column */
  private readonly colIndex: number[] = [];
  private readonly model: Model;
  private numRows: number;
  private numCols = 0;
  private lastX: Float64Array = new Float64Array(0);
  readonly crewRow: number[];
  readonly coverRow = new Map<number, number>();
  readonly openCol = new Map<number, number>();
  reserveRow = -1;
  coverageRow = -1;
  readonly fairRow: number[] = [];
  readonly fairCol: number[] = [];
  /** strict seniority: the least score of a usable line of each settled crew member (a reserve line scores 0) */
  readonly minScore: number[] = [];
  /** master column indices of each crew member's columns */
  private readonly crewColumns: number[][];
  /** [lower, upper] of every row */
  private readonly rowBounds: [number, number][];
  /** objective coefficient of each open-time column u_p (phase 1: −c_p; phase 2: 0) and the coverage row's c_p */
  private readonly openCost = new Map<number, number>();
  private readonly coverageCoefficient = new Map<number, number>();
  private fairnessSettings: { floor: number; penalty: number } | undefined;

  constructor(
    private readonly highs: Highs,
    crewCount: number,
    /** pairing index → crew needed (only pairings someone may fly) */
    private readonly need: ReadonlyMap<number, number>,
    /** reserve lines allowed, counted in crew members */
    reserve: { min: number; max: number },
    /** crew members behind each crew row (a buddy unit: 2, its line filling two positions of each trip); 1 when absent */
    private readonly sizes: readonly number[] = [],
  ) {
    this.crewColumns = Array.from({ length: crewCount }, () => []);
    this.model = highs.createModel();
    this.model.options.set({ output_flag: false, random_seed: 0 });
    const rowLower: number[] = [];
    const rowUpper: number[] = [];
    this.crewRow = Array.from({ length: crewCount }, (_, i) => {
      rowLower.push(1);
      rowUpper.push(1);
      return i;
    });
    for (const [p, d] of need) {
      this.coverRow.set(p, rowLower.length);
      rowLower.push(d);
      rowUpper.push(d);
    }
    const members = this.sizes.reduce((t, x) => t + x - 1, crewCount);
    if (reserve.min > 0 || reserve.max < members) {
      this.reserveRow = rowLower.length;
      rowLower.push(reserve.min);
      rowUpper.push(reserve.max);
    }
    this.numRows = rowLower.length;
    this.rowBounds = rowLower.map((lo, r) => [lo, rowUpper[r]!]);
    this.model.passModel({
      numCols: 0,
      numRows: this.numRows,
      sense: highs.constants.objectiveSense.maximize,
      colCost: [],
      colLower: [],
      colUpper: [],
      rowLower,
      rowUpper,
      matrix: { format: "csc", numRows: this.numRows, numCols: 0, starts: [0], indices: [], values: [] },
    });
    for (const [p, d] of need) {
      this.openCol.set(p, this.numCols);
      // No upper bounds on u_p or λ: the rows imply u_p ≤ d_p and λ ≤ 1, and an
      // explicit bound would let a column sit at it with its row's dual
      // undetermined — degenerate duals that send pricing after lines that
      // cannot help (measured: 50 rounds without progress on a published base).
      this.addRawCol(0, 0, Infinity, [this.coverRow.get(p)!], [1]);
    }
    // Surplus s_p ≥ 0 (over-cover) with a penalty, in the LP only: it boxes the
    // cover rows' duals (y_p ≤ penalty), which set partitioning otherwise
    // leaves free to grow on covered trips (du Merle, Villeneuve, Desrosiers &
    // Hansen 1999, in its simplest form). The LP stays a relaxation, so its
    // bounds stay valid; the integer solves forbid surplus.
    for (const p of need.keys()) this.surplusCol.set(p, this.addRawCol(0, 0, 0, [this.coverRow.get(p)!], [-1]));
  }

  readonly surplusCol = new Map<number, number>();

  /** The LP's penalty per unit of surplus on each pairing (0 turns surplus off). */
  setSurplusPenalty(penalty: (pairing: number) => number): void {
    for (const [p, col] of this.surplusCol) {
      const pen = penalty(p);
      this.model.changeColCost(col, -pen);
      this.model.changeColBounds(col, 0, pen > 0 ? Infinity : 0);
    }
  }

  private addRawCol(cost: number, lower: number, upper: number, indices: number[], values: number[]): number {
    this.model.addCol(cost, lower, upper, { indices, values });
    return this.numCols++;
  }

  private addRawRow(lower: number, upper: number, indices: number[], values: number[]): number {
    this.model.addRow(lower, upper, { indices, values });
    this.rowBounds.push([lower, upper]);
    return this.numRows++;
  }

  static key(column: Pick<MasterColumn, "crew" | "pairings" | "reserve">): string {
    return `${column.crew}:${column.reserve ? "R" : column.pairings.join(",")}`;
  }

  has(column: Pick<MasterColumn, "crew" | "pairings" | "reserve">): boolean {
    return this.keys.has(Master.key(column));
  }

  /** Adds a column with objective coefficient `cost` (and `fairness`, its coefficient in the crew's fairness row). */
  add(column: MasterColumn, cost: number, fairness = 0): boolean {
    const key = Master.key(column);
    if (this.keys.has(key)) return false;
    this.keys.add(key);
    const indices = [this.crewRow[column.crew]!];
    const values = [1];
    const size = this.sizes[column.crew] ?? 1;
    for (const p of column.pairings) {
      indices.push(this.coverRow.get(p)!);
      values.push(size);
    }
    if (column.reserve && this.reserveRow >= 0) {
      indices.push(this.reserveRow);
      values.push(size);
    }
    const fair = this.fairRow[column.crew];
    if (fair !== undefined && fairness !== 0) {
      indices.push(fair);
      values.push(fairness);
    }
    this.colIndex.push(this.addRawCol(cost, 0, this.usable(column) ? Infinity : 0, indices, values));
    this.crewColumns[column.crew]!.push(this.columns.length);
    this.columns.push(column);
    return true;
  }

  private usable(column: MasterColumn): boolean {
    const min = this.minScore[column.crew];
    return min === undefined || (column.reserve ? 0 : column.score) >= min;
  }

  /**
   * Strict seniority: from now on crew member i holds a line scoring at least
   * `min` (a reserve line scores 0): every other column of theirs, present or
   * future, is bounded at 0.
   */
  settle(i: number, min: number): void {
    if (this.minScore[i] !== undefined) throw new AppError("internal", `crew ${i} is settled already`);
    this.restrict(i, min);
  }

  /** Bounds crew member i's columns scoring below `min` at 0, until `release(i)` (a probe of strict seniority). */
  restrict(i: number, min: number): void {
    this.minScore[i] = min;
    for (const k of this.crewColumns[i]!) {
      if (!this.usable(this.columns[k]!)) this.model.changeColBounds(this.colIndex[k]!, 0, 0);
    }
  }

  /** Undoes `restrict(i, …)` for a crew member who is not settled. */
  release(i: number): void {
    delete this.minScore[i];
    for (const k of this.crewColumns[i]!) this.model.changeColBounds(this.colIndex[k]!, 0, Infinity);
  }

  /**
   * Strict seniority's coverage probe and back: with `openCost` the objective
   * is −Σ c_p u_p and the coverage row is lifted (every line's cost is the
   * caller's to set); without, open time costs nothing and the coverage row
   * holds Σ c_p u_p ≤ `limit` again.
   */
  probeCoverage(openCost: ReadonlyMap<number, number> | undefined, limit: number): void {
    for (const [p, col] of this.openCol) {
      const c = openCost ? -(openCost.get(p) ?? 0) : 0;
      this.model.changeColCost(col, c);
      this.openCost.set(p, c);
    }
    if (this.coverageRow >= 0) {
      const upper = openCost ? Infinity : limit;
      this.model.changeRowBounds(this.coverageRow, -Infinity, upper);
      this.rowBounds[this.coverageRow] = [-Infinity, upper];
    }
  }

  /** Sets the objective coefficient of each of crew member i's columns. */
  setCrewCosts(i: number, cost: (column: MasterColumn) => number): void {
    for (const k of this.crewColumns[i]!) this.model.changeColCost(this.colIndex[k]!, cost(this.columns[k]!));
  }

  /** Phase 1's objective: maximise −Σ c_p u_p, every line worth 0. */
  setCoverageObjective(openCost: ReadonlyMap<number, number>): void {
    for (const [p, col] of this.openCol) {
      this.model.changeColCost(col, -(openCost.get(p) ?? 0));
      this.openCost.set(p, -(openCost.get(p) ?? 0));
    }
  }

  /**
   * Phase 2: keep Σ c_p u_p ≤ limit, set each column's objective coefficient
   * (`cost(column)`), and with a floor add the elastic fairness rows.
   */
  setWishObjective(
    openCost: ReadonlyMap<number, number>,
    limit: number,
    cost: (column: MasterColumn) => number,
    fairness?: { floor: number; penalty: number; coefficient: (column: MasterColumn) => number; crewCount: number },
  ): void {
    const indices: number[] = [];
    const values: number[] = [];
    for (const [p, col] of this.openCol) {
      this.model.changeColCost(col, 0);
      this.openCost.set(p, 0);
      this.coverageCoefficient.set(p, openCost.get(p) ?? 0);
      indices.push(col);
      values.push(openCost.get(p) ?? 0);
    }
    this.coverageRow = this.addRawRow(-Infinity, limit, [], []);
    indices.forEach((col, k) => this.model.changeCoefficient(this.coverageRow, col, values[k]!));
    if (fairness) {
      this.fairnessSettings = { floor: fairness.floor, penalty: fairness.penalty };
      for (let i = 0; i < fairness.crewCount; i++) {
        this.fairRow[i] = this.addRawRow(fairness.floor, Infinity, [], []);
        this.fairCol[i] = this.addRawCol(-fairness.penalty, 0, Infinity, [this.fairRow[i]!], [1]);
      }
    }
    this.columns.forEach((column, k) => {
      this.model.changeColCost(this.colIndex[k]!, cost(column));
      const fair = this.fairRow[column.crew];
      if (fairness && fair !== undefined) {
        const a = fairness.coefficient(column);
        if (a !== 0) this.model.changeCoefficient(fair, this.colIndex[k]!, a);
      }
    });
  }

  private run(timeLimit: number, stop: () => boolean, target?: number): SolveOutcome {
    // HiGHS measures time_limit on the model's own clock, which runs on across solves.
    this.model.zeroAllClocks();
    this.model.options.set({ time_limit: Math.max(0.01, timeLimit) });
    let reached = false;
    const interrupt = (event: { interrupt(): void; data: { mip_primal_bound?: number } }) => {
      if (target !== undefined && (event.data.mip_primal_bound ?? -Infinity) >= target) {
        reached = true;
        event.interrupt();
      } else if (stop()) event.interrupt();
      return undefined;
    };
    const result = this.model.run({ 1: interrupt, 2: interrupt, 6: interrupt });
    this.lastX = this.model.getSolution().colValue;
    const codes = this.highs.constants.modelStatus;
    const status =
      result.modelStatus === codes.optimal ? "optimal"
      : result.modelStatus === codes.timeLimit ? "time-limit"
      : result.modelStatus === codes.interrupted ? (reached ? "target" : "interrupted")
      : result.modelStatus === codes.infeasible ? "infeasible"
      : "other";
    return { status, objective: this.model.getObjectiveValue() };
  }

  /** Solves the LP relaxation; duals follow from `duals()`. */
  solveLp(timeLimit: number, stop: () => boolean, infeasibleOk = false): SolveOutcome {
    this.model.clearIntegrality();
    this.model.options.set({ solver: "choose" });
    const outcome = this.run(timeLimit, stop);
    if (infeasibleOk && outcome.status === "infeasible") return outcome;
    if (outcome.status === "infeasible" || outcome.status === "other") {
      throw new AppError("internal", `the master LP could not be solved (${outcome.status}, HiGHS model status ${this.model.getModelStatus()})`);
    }
    return outcome;
  }

  /** Rows of the model (the length of a dual vector). */
  get rowCount(): number {
    return this.numRows;
  }

  /** Row duals of the last LP solve. */
  duals(): Float64Array {
    return this.model.getSolution().rowDual;
  }

  /**
   * Duals made usable by `lagrangianBound`: a row with no upper bound (≥) gets
   * y ≤ 0, one with no lower bound (≤) y ≥ 0 — the signs an optimal dual has,
   * which a solve may miss by its tolerances.
   */
  project(y: Float64Array): Float64Array {
    const out = Float64Array.from(y);
    this.rowBounds.forEach(([lo, hi], r) => {
      if (hi === Infinity) out[r] = Math.min(0, out[r]!);
      if (lo === -Infinity) out[r] = Math.max(0, out[r]!);
    });
    return out;
  }

  /**
   * The Lagrangian bound at duals y (projected): every row but the crew rows is
   * priced, so for any y
   *
   *     L(y) = Σ_i line_i + Σ_r (y_r ≥ 0 ? y_r·upper_r : y_r·lower_r)
   *            + Σ_p d_p·max(0, rc(u_p)) + Σ_i φ·max(0, rc(f_i))
   *
   * bounds every solution that covers exactly (no surplus or under-cover,
   * u_p ≤ d_p, f_i ≤ φ), where line_i is an upper bound on crew i's best
   * c_ℓ − Σ_r y_r a_rℓ over all of their lines (the crew row's own dual left
   * out) — from pricing, and at least the reserve line's value. At the LP's
   * optimal duals with exhausted pricing it is the LP optimum.
   */
  lagrangianBound(y: Float64Array, line: readonly number[]): number {
    let total = 0;
    this.crewRow.forEach((_, i) => (total += this.crewTerm(y, line[i]!, i)));
    const crewRows = new Set(this.crewRow);
    this.rowBounds.forEach(([lo, hi], r) => {
      if (crewRows.has(r)) return;
      const v = y[r]!;
      if (v > 0) total += v * hi;
      else if (v < 0) total += v * lo;
    });
    const z = this.coverageRow >= 0 ? y[this.coverageRow]! : 0;
    for (const [p, row] of this.coverRow) {
      const rc = (this.openCost.get(p) ?? 0) - y[row]! - z * (this.coverageCoefficient.get(p) ?? 0);
      total += this.need.get(p)! * Math.max(0, rc);
    }
    if (this.fairnessSettings) {
      const { floor, penalty } = this.fairnessSettings;
      for (const r of this.fairRow) total += floor * Math.max(0, -penalty - y[r]!);
    }
    return total;
  }

  /**
   * Crew member i's term in `lagrangianBound`: their best line value at y, or
   * their reserve line's if higher and still usable (`settle`).
   */
  crewTerm(y: Float64Array, line: number, i: number): number {
    if ((this.minScore[i] ?? 0) > 0) return line;
    return Math.max(line, this.reserveRow >= 0 ? -(this.sizes[i] ?? 1) * y[this.reserveRow]! : 0);
  }

  /** Values of the master columns in the last solve. */
  values(): number[] {
    const x = this.lastX;
    return this.colIndex.map((c) => x[c]!);
  }

  /** Values of the open-time columns by pairing, and of the fairness slacks by crew. */
  slacks(): { open: Map<number, number>; fairness: number[] } {
    const x = this.lastX;
    return {
      open: new Map([...this.openCol].map(([p, c]) => [p, x[c]!])),
      fairness: this.fairCol.map((c) => x[c]!),
    };
  }

  /** Turns the LP's surplus off (the integer solve needs exact cover) or back on. */
  surplusAllowed(on: boolean): void {
    if (!on) {
      if (this.savedSurplus) return; // already off
      this.savedSurplus = [...this.surplusCol.values()].map((col) => this.model.getCols({ kind: "set", indices: [col] }).upper[0]!);
      for (const col of this.surplusCol.values()) this.model.changeColBounds(col, 0, 0);
    } else if (this.savedSurplus) {
      [...this.surplusCol.values()].forEach((col, k) => this.model.changeColBounds(col, 0, this.savedSurplus![k]!));
      this.savedSurplus = undefined;
    }
  }

  private savedSurplus: number[] | undefined;

  /** Solves with the line columns binary (price-and-branch on the columns so far). */
  solveMip(timeLimit: number, stop: () => boolean, gapTolerance: number, start?: readonly MasterColumn[], target?: number, infeasibleOk = false): SolveOutcome {
    this.surplusAllowed(false);
    this.model.changeColsIntegrality({ kind: "set", indices: this.colIndex }, this.colIndex.map(() => 1 as const));
    if (start) {
      // A known integer solution (one column per crew member) as the MIP's first incumbent.
      const chosen = new Set(start.map((c) => Master.key(c)));
      const x = new Float64Array(this.numCols);
      const open = new Map(this.need);
      this.columns.forEach((c, k) => {
        if (!chosen.has(Master.key(c))) return;
        x[this.colIndex[k]!] = 1;
        for (const p of c.pairings) open.set(p, (open.get(p) ?? 0) - (this.sizes[c.crew] ?? 1));
      });
      for (const [p, col] of this.openCol) x[col] = Math.max(0, open.get(p) ?? 0);
      this.model.setSolution({ colValue: x });
    }
    this.model.options.set({ mip_rel_gap: gapTolerance, mip_abs_gap: 1e-9, solver: "choose" });
    // With a target the solve stops at the first incumbent that reaches it.
    const outcome = this.run(timeLimit, stop, target);
    const bound = Number(this.model.info.get("mip_dual_bound"));
    this.model.clearIntegrality();
    this.surplusAllowed(true);
    if ((outcome.status === "infeasible" && !infeasibleOk) || outcome.status === "other") {
      throw new AppError("internal", `the master MIP could not be solved (${outcome.status})`);
    }
    return { ...outcome, bound };
  }

  dispose(): void {
    this.model.dispose();
  }
}
