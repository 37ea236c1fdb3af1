/**
 * Events of planned work and incidents that people may be told about.
 *
 * The operations services emit them inside the transaction of the change that
 * caused them; whoever listens (the notices queue) enqueues its own work in
 * that same transaction, so an event is stored exactly when its change is.
 */
import type { Transaction } from 'sequelize';

export type OperationsEventKind =
  | 'incident-opened'
  | 'incident-updated'
  | 'incident-closed'
  | 'work-approved'
  | 'work-started'
  | 'work-cancelled'
  | 'work-clash';

export interface OperationsEvent {
  kind: OperationsEventKind;
  /** the incident's or planned work's code */
  code: string;
  title: string;
  /** stable for one happening: at most one notice per address per key */
  key: string;
  /** ISO 8601 in UTC: the work's window start, or when the incident started */
  start: string;
  /** ISO 8601 in UTC, or null while open-ended */
  end: string | null;
  networkVersion: number;
  /** carriage codes off air and on reserve, and the households at their sites */
  reach: { lost: string[]; fallback: string[]; households: { lost: number; fallback: number } };
  /** for a clash: the other work's or incident's code */
  other?: string;
  /** one line a person can read: what changed */
  summary: string;
}

export type OperationsEventSink = (t: Transaction, event: OperationsEvent) => Promise<void>;

/** Fans an event out to every sink; a service holds one and calls emit inside its transaction. */
export class OperationsEvents {
  private readonly sinks: OperationsEventSink[] = [];
  subscribe(sink: OperationsEventSink): () => void {
    this.sinks.push(sink);
    return () => {
      const i = this.sinks.indexOf(sink);
      if (i >= 0) this.sinks.splice(i, 1);
    };
  }
  async emit(t: Transaction, event: OperationsEvent): Promise<void> {
    for (const sink of this.sinks) await sink(t, event);
  }
}
