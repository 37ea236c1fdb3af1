/**
 * Invented site names for generated networks: syllables strung together,
 * then a landform word. They are made up, so no real place or station is
 * meant by any of them.
 */
import type { Prng } from './prng';

const ONSETS = ['b', 'br', 'c', 'cr', 'd', 'dr', 'f', 'g', 'gr', 'h', 'k', 'l', 'm', 'n', 'p', 'qu', 'r', 's', 'st', 't', 'tr', 'v', 'w', 'z'];
const VOWELS = ['a', 'e', 'i', 'o', 'u', 'ae', 'ei', 'ou'];
const CODAS = ['', '', 'l', 'n', 'r', 'rr', 's', 'th', 'v', 'ck', 'nn', 'sk'];
const ORIGIN_WORDS = ['Playout Centre', 'Playout Hub', 'Studio Block', 'Uplink'];
const MAIN_WORDS = ['Beacon', 'Summit', 'Height', 'Down', 'Tor'];
const RELAY_WORDS = ['Knoll', 'Gap', 'Cross', 'Bank', 'Rigg', 'Hollow', 'Side', 'End', 'Top', 'Point'];

function syllable(prng: Prng): string {
  return prng.pick(ONSETS) + prng.pick(VOWELS) + prng.pick(CODAS);
}

function word(prng: Prng): string {
  const text = syllable(prng) + syllable(prng) + (prng.chance(0.3) ? syllable(prng) : '');
  return text.charAt(0).toUpperCase() + text.slice(1);
}

export function siteName(prng: Prng, role: 'origin' | 'main' | 'relay'): string {
  const words = role === 'origin' ? ORIGIN_WORDS : role === 'main' ? MAIN_WORDS : RELAY_WORDS;
  return `${word(prng)} ${prng.pick(words)}`;
}
