/**
 * The diagram's columns asked for as the page starts. A page opened on the
 * network screen (a shared link, a reload) would otherwise send this, the
 * largest answer of the app, only once the scripts, fonts, session and the
 * screen's own chunk are in: over a second at 20,000 sites on the test
 * machine. The boot script (src/boot/earlyStart.ts) sends it before the
 * app's scripts have arrived; the root layout calls `startDrawingEarly` when
 * the page opens there, which takes that request over, or sends it with the
 * stored session's token when there was none (no boot script: the
 * development server). `useDiagramDrawing` takes the answer once
 * (`takeEarlyDrawing`) if the session is still the one it was asked for;
 * anything else (signed out, another person, an error answer, no
 * connection) falls back to the usual request, which reports it as always.
 */
import { api } from '@/shared/api';
import { checkDrawing, drawingDocumentSchema, type DrawingDocument } from '@/shared/schemas/drawing';
import { askDrawingOnPage, openedPath, type EarlyAnswer, type EarlyDrawing } from '@/src/boot/earlyStart';
import { readPersistedSession, SESSION_STORAGE_KEY } from '@/src/session/persisted';
import { ApiError, parseAnswer } from '../client';

/** The drawing's answer checked (shape, then every position: checkDrawing), or an ApiError naming what is wrong. */
export function readDrawing(path: string, value: unknown): DrawingDocument {
  const columns = parseAnswer(drawingDocumentSchema, path, value);
  try {
    checkDrawing(columns);
  } catch (e) {
    throw new ApiError(200, 'bad-response', `The server's answer to ${path} was not understood: ${(e as Error).message}.`);
  }
  return columns;
}

let early: { token: string; doc: Promise<DrawingDocument | null>; ready?: DrawingDocument | null } | null = null;

/**
 * Checked as soon as it is in, while the app is still starting (the route's
 * screen waits on its script meanwhile): a bad answer is dropped here and
 * asked for again as usual, which reports it.
 */
function hold(token: string, answer: Promise<EarlyAnswer | null>): void {
  const held: NonNullable<typeof early> = { token, doc: answer.then((a) => (a ? readDrawing(api.networkDrawing, a.value) : null)).catch(() => null) };
  void held.doc.then((doc) => (held.ready = doc));
  early = held;
}

/**
 * The early answer when it is in and checked already (without taking it), for
 * `token`; undefined otherwise. The screen starts from it in its first render,
 * so the model is built while the page would otherwise wait to show the screen.
 */
export function peekEarlyDrawing(token: string | null): DrawingDocument | undefined {
  return early && token && early.token === token && early.ready ? early.ready : undefined;
}

/** True for the network screen's address (map or schematic: both draw from the columns). */
export function opensNetworkDiagram(pathname: string): boolean {
  return openedPath(pathname) === '/network';
}

/**
 * Takes over the boot script's request when `page` holds one, else sends the
 * request now when a session is stored; true when a request is under way.
 */
export function startDrawingEarly(storage: Pick<Storage, 'getItem'> | undefined, page?: { __headwaterEarlyDrawing?: EarlyDrawing }): boolean {
  const booted = page?.__headwaterEarlyDrawing;
  if (booted) {
    page.__headwaterEarlyDrawing = undefined;
    hold(booted.token, booted.answer);
    return true;
  }
  let raw: string | null | undefined;
  try {
    raw = storage?.getItem(SESSION_STORAGE_KEY);
  } catch {
    return false; // storage refused (private browsing): the usual request will do
  }
  const { token } = readPersistedSession(raw);
  if (!token) return false;
  hold(token, askDrawingOnPage(fetch, api.networkDrawing, token));
  return true;
}

/** The early answer, checked, once, when it was asked with `token` and came back ok; null otherwise (the caller then asks as usual). */
export async function takeEarlyDrawing(token: string | null): Promise<DrawingDocument | null> {
  const held = early;
  early = null;
  if (!held || !token || held.token !== token) return null;
  return held.doc;
}
