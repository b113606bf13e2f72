import { ATOMIC_WEIGHTS } from "../../data/atomic-weights";
import { Dec, ZERO } from "./decimal";
import { FormulationError } from "./errors";

/** Separators that join the parts of an adduct or hydrate, e.g. "Ca(NO3)2·4H2O". */
const ADDUCT_SEPARATORS = new Set(["·", "•", "*"]);

class FormulaReader {
  private pos = 0;
  constructor(
    private readonly text: string,
    private readonly field: string,
  ) {}

  fail(reason: string): never {
    throw new FormulationError("invalid_formula", this.field, `formula "${this.text}" ${reason}`);
  }

  peek(): string {
    return this.text.charAt(this.pos);
  }

  done(): boolean {
    return this.pos >= this.text.length;
  }

  number(): Dec | undefined {
    const match = /^\d+(\.\d+)?/.exec(this.text.slice(this.pos));
    if (!match) return undefined;
    this.pos += match[0].length;
    return new Dec(match[0]);
  }

  /** Reads groups until a closing bracket, a separator or the end. */
  sequence(closing?: string): Map<string, Dec> {
    const counts = new Map<string, Dec>();
    let groups = 0;
    while (!this.done()) {
      const ch = this.peek();
      if (ch === closing || ADDUCT_SEPARATORS.has(ch)) break;
      let inner: Map<string, Dec>;
      if (ch === "(" || ch === "[") {
        this.pos += 1;
        inner = this.sequence(ch === "(" ? ")" : "]");
        if (this.peek() !== (ch === "(" ? ")" : "]")) this.fail("has an unclosed bracket");
        this.pos += 1;
      } else if (/[A-Z]/.test(ch)) {
        const match = /^[A-Z][a-z]?/.exec(this.text.slice(this.pos));
        const symbol = match?.[0] ?? ch;
        const weight = ATOMIC_WEIGHTS[symbol];
        if (weight === undefined) this.fail(`contains "${symbol}", which is not in the atomic-weight table`);
        this.pos += symbol.length;
        inner = new Map([[symbol, new Dec(1)]]);
      } else {
        this.fail(`has an unexpected character "${ch}" at position ${this.pos + 1}`);
      }
      const multiplier = this.number() ?? new Dec(1);
      for (const [symbol, count] of inner) {
        counts.set(symbol, (counts.get(symbol) ?? ZERO).plus(count.times(multiplier)));
      }
      groups += 1;
    }
    if (groups === 0) this.fail("has an empty part");
    return counts;
  }

  formula(): Map<string, Dec> {
    const total = new Map<string, Dec>();
    for (;;) {
      const coefficient = this.number() ?? new Dec(1);
      const part = this.sequence();
      for (const [symbol, count] of part) {
        total.set(symbol, (total.get(symbol) ?? ZERO).plus(count.times(coefficient)));
      }
      if (this.done()) return total;
      if (ADDUCT_SEPARATORS.has(this.peek())) {
        this.pos += 1;
        continue;
      }
      this.fail(`has an unmatched "${this.peek()}"`);
    }
  }
}

/**
 * Parses a chemical formula into element counts (atoms per formula unit).
 * Supports element symbols, integer or decimal counts (e.g. "SiO1.5"),
 * nested ( ) and [ ] groups, and adducts or hydrates joined by "·", "•" or
 * "*" with an optional leading coefficient ("Ca(NO3)2·4H2O").
 * Spaces are ignored. Throws FormulationError "invalid_formula" on bad syntax
 * or an element missing from the atomic-weight table.
 *
 * @param formula - the formula, e.g. "Si(OC2H5)4"
 * @param field - the input field named in an error (default "formula")
 * @returns element symbol → number of atoms per formula unit
 * @example
 * ```ts
 * parseFormula("Si(OC2H5)4"); // { Si: 1, O: 4, C: 8, H: 20 }
 * ```
 */
export function parseFormula(formula: string, field = "formula"): Record<string, number> {
  const text = formula.replace(/\s+/g, "");
  if (text.length === 0) throw new FormulationError("invalid_formula", field, "formula is empty");
  const counts = new FormulaReader(text, field).formula();
  const result: Record<string, number> = {};
  for (const [symbol, count] of counts) result[symbol] = count.toNumber();
  return result;
}

/**
 * Molar mass of a formula, g/mol, from IUPAC/CIAAW 2021 standard atomic
 * weights (abridged values), summed in decimal arithmetic.
 *
 * @param formula - the formula, e.g. "C8H20O4Si" or "Ca(NO3)2·4H2O"
 * @param field - the input field named in an error (default "formula")
 * @returns molar mass in g/mol, full precision
 * @example
 * ```ts
 * molarMassOf("SiO2"); // 60.083 (28.085 + 2 × 15.999)
 * ```
 */
export function molarMassOf(formula: string, field = "formula"): number {
  const text = formula.replace(/\s+/g, "");
  if (text.length === 0) throw new FormulationError("invalid_formula", field, "formula is empty");
  const counts = new FormulaReader(text, field).formula();
  let mass = ZERO;
  for (const [symbol, count] of counts) {
    // parse() has already rejected unknown symbols
    mass = mass.plus(count.times(ATOMIC_WEIGHTS[symbol] ?? 0));
  }
  return mass.toNumber();
}
