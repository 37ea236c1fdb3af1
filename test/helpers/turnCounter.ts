/**
 * Counts the turns the event loop gets while some work runs: a check that
 * work done in slices lets other work in. `stop()` ends the count and gives it.
 */
export function countTurns(): { stop(): number } {
  let turns = 0;
  let on = true;
  const tick = () => {
    if (!on) return;
    turns++;
    setImmediate(tick);
  };
  setImmediate(tick);
  return {
    stop() {
      on = false;
      return turns;
    },
  };
}
