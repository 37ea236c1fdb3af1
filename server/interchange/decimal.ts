/**
 * Whether a CSV cell is a plain decimal number:
 *   [+-]? ( digits [ "." digits* ] | "." digits ) ( [eE] [+-]? digits )?
 * (Number() alone would also take "", "0x1F" and "Infinity".) A fixed automaton reads the text once, left to right,
 * each character at most once, and stops at the first one that cannot
 * continue a number: no pattern engine is involved, so no cell (a 100 KB
 * digit run ending in a letter, say) can make it try alternatives, and its
 * work is at most the cell's length by construction.
 */

const enum State {
  Start,
  Sign,
  Whole,
  PointFirst,
  Fraction,
  ExponentMark,
  ExponentSign,
  Exponent,
  Reject,
}

const isDigit = (ch: number) => ch >= 48 && ch <= 57;
const PLUS = 43;
const MINUS = 45;
const POINT = 46;
const isExponentMark = (ch: number) => ch === 69 || ch === 101;

function next(state: State, ch: number): State {
  const digit = isDigit(ch);
  switch (state) {
    case State.Start:
      return ch === PLUS || ch === MINUS ? State.Sign : digit ? State.Whole : ch === POINT ? State.PointFirst : State.Reject;
    case State.Sign:
      return digit ? State.Whole : ch === POINT ? State.PointFirst : State.Reject;
    case State.Whole:
      return digit ? State.Whole : ch === POINT ? State.Fraction : isExponentMark(ch) ? State.ExponentMark : State.Reject;
    case State.PointFirst:
      return digit ? State.Fraction : State.Reject;
    case State.Fraction:
      return digit ? State.Fraction : isExponentMark(ch) ? State.ExponentMark : State.Reject;
    case State.ExponentMark:
      return ch === PLUS || ch === MINUS ? State.ExponentSign : digit ? State.Exponent : State.Reject;
    case State.ExponentSign:
    case State.Exponent:
      return digit ? State.Exponent : State.Reject;
    default:
      return State.Reject;
  }
}

/**
 * The automaton over characters handed out by `charAt(i)` (a UTF-16 code
 * unit), i = 0 .. length - 1, each asked for at most once, in order. Split
 * from `isDecimal` so that a test can count the reads.
 */
export function scanDecimal(length: number, charAt: (i: number) => number): boolean {
  let state = State.Start;
  for (let i = 0; i < length; i++) {
    state = next(state, charAt(i));
    if (state === State.Reject) return false;
  }
  return state === State.Whole || state === State.Fraction || state === State.Exponent;
}

export function isDecimal(text: string): boolean {
  return scanDecimal(text.length, (i) => text.charCodeAt(i));
}
