/**
 * An edit's update of the engine (server/engine/update.ts) against a full
 * build of the same document: after each of 1,000 random edits (sites,
 * carriages, feeds and groups created, changed and deleted, deletes taking
 * their dependents), over random networks, the updated engine gives the same
 * reach, chains, single points of failure, exposure, diversity and unfed
 * answers as one built from scratch.
 */
import { describe, expect, it } from 'vitest';
import { NetworkEngine } from '@/server/engine/engine';
import { smallRandomNetwork, prng } from '@/test/helpers/random-network';
import { RandomEditor, applyEdit, inCodeOrder } from '@/test/helpers/random-edits';
import type { Element } from '@/shared/schemas/analysis';
import type { NetworkDocument } from '@/shared/schemas/network';

function sameAnswers(updated: NetworkEngine, built: NetworkEngine, rnd: () => number) {
  expect(updated.counts).toEqual(built.counts);
  expect(updated.unfed()).toEqual(built.unfed());
  expect(updated.spof()).toEqual(built.spof());
  expect(updated.exposure()).toEqual(built.exposure());
  expect(updated.diversity()).toEqual(built.diversity());
  // Carriages are elements too (parent transmitters as weak points): their ids move with an edit like the rest.
  const all = ['site', 'carriage', 'feed', 'group'] as const;
  expect(updated.spof(all)).toEqual(built.spof(all));
  expect(updated.exposure(undefined, all)).toEqual(built.exposure(undefined, all));
  expect(updated.exposureGroups(undefined, all)).toEqual(built.exposureGroups(undefined, all));
  const elements = built.elements() as Element[];
  const sets = [...elements.filter(() => rnd() < 0.3).map((e) => [e]), ...Array.from({ length: 4 }, () => elements.filter(() => rnd() < 0.15))];
  for (const failed of sets) expect(updated.reach(failed)).toEqual(built.reach(failed));
  for (const c of built.unfed().carriages.slice(0, 2).concat(built.spof().carriages.filter(() => rnd() < 0.1).map((r) => ({ carriage: r.carriage, service: '', site: '' })))) {
    expect(updated.chain(c.carriage, 'up')).toEqual(built.chain(c.carriage, 'up'));
    expect(updated.chain(c.carriage, 'down')).toEqual(built.chain(c.carriage, 'down'));
  }
}

describe('an edit updates the engine to what a full build gives', () => {
  it('1,000 random edits over 8 random networks, compared after every edit', () => {
    let edits = 0;
    let incremental = 0;
    let rebuiltServices = 0;
    let services = 0;
    for (let n = 0; n < 8; n++) {
      const seed = 1000 + n;
      const rnd = prng(seed * 7 + 1);
      let doc: NetworkDocument = inCodeOrder(
        smallRandomNetwork({ seed, sites: 12 + n * 3, services: 2 + (n % 3), groups: 3, feeds: 30 + n * 4, originChance: 0.15, carriageChance: 0.7 }),
      );
      let engine = NetworkEngine.build(doc, 1);
      const editor = new RandomEditor(rnd);
      for (let i = 0; i < 125; i++) {
        const edit = editor.next(doc);
        if (!edit) {
          i--;
          continue;
        }
        doc = applyEdit(doc, edit);
        const version = engine.networkVersion + 1;
        engine = NetworkEngine.update(engine, doc, version, edit.codes);
        edits++;
        if (engine.incremental) incremental++;
        rebuiltServices += engine.timings.rebuiltServices;
        services += doc.services.length;
        sameAnswers(engine, NetworkEngine.build(doc, version), rnd);
      }
    }
    expect(edits).toBe(1000);
    // every one of these edits is one an update handles: none may quietly fall back to a full build
    expect(incremental).toBe(1000);
    // and an update rebuilds only some services, not all of them every time
    expect(rebuiltServices).toBeLessThan(services * 0.75);
  });
});
