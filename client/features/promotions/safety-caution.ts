/**
 * The safety caution of the product brief, shown word for word before a kernel is promoted or
 * reinstated. The server sends the same text with every promotion (server/mail/safety-caution.ts);
 * tests/e2e/promote.test.ts checks that the two agree.
 */
export const safetyCaution =
  "Passing Stablehand's checks is evidence, not certification. Kernels used in safety-relevant " +
  "work (structures, vehicles, medical devices, process control) still go through the organisation's " +
  'own verification and validation and the standards and codes that apply there, under the ' +
  'responsibility of qualified engineers.';
