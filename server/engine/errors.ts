/** Typed errors the routes turn into 404 answers naming the code. */
import type { Element } from '@/shared/schemas/analysis';

export class UnknownElementsError extends Error {
  readonly elements: Element[];
  constructor(elements: Element[]) {
    super(`unknown element${elements.length === 1 ? '' : 's'}: ${elements.map((e) => `${e.kind} ${e.code}`).join(', ')}`);
    this.name = 'UnknownElementsError';
    this.elements = elements;
  }
}

export class UnknownCarriageError extends Error {
  readonly carriage: string;
  constructor(carriage: string) {
    super(`unknown carriage: ${carriage}`);
    this.name = 'UnknownCarriageError';
    this.carriage = carriage;
  }
}
