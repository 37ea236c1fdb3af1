/**
 * The "Needs attention now" list on Home. Each entry is a panel another
 * feature adds (say, carriages off air, unfed carriages, failed checks):
 * a component that fetches what it needs, draws its own Card(s) with
 * `emphasis="attention"`, and renders null when there is nothing to act on.
 * Home shows the section only when at least one panel is registered.
 *
 * To add one: import the panel component here and append
 *   { id: 'unfed', Panel: UnfedCarriagesPanel }
 * in the order the panels should appear (most urgent first).
 */
import type { ComponentType } from 'react';
import { AttentionList } from './AttentionList';

export interface AttentionPanel {
  /** Stable key, also used as the panel's testID prefix. */
  id: string;
  Panel: ComponentType;
}

export const ATTENTION_PANELS: readonly AttentionPanel[] = [{ id: 'analysis', Panel: AttentionList }];
