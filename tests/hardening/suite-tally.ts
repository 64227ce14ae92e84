/**
 * Counts for one hardening suite: cases tried, cases that ended as they should (contained or
 * rejected), and the rest (lost). Each test calls `tried()` first and `held()` as its last step,
 * so a failed assertion leaves the case counted as lost. `print` goes in the suite's afterAll.
 */
export interface SuiteTally {
  tried(): void;
  held(): void;
  print(): void;
}

export function suiteTally(suite: string, heldWord = 'contained'): SuiteTally {
  let tried = 0;
  let held = 0;
  return {
    tried: () => {
      tried += 1;
    },
    held: () => {
      held += 1;
    },
    print: () => {
      console.log(`${suite}: ${tried} tried / ${held} ${heldWord} / ${tried - held} lost`);
    },
  };
}
