/** The safety caution (product.md), shown wherever a kernel becomes the incumbent. */
export const safetyCaution =
  "Passing Stablehand's checks is evidence, not certification. Kernels used in safety-relevant " +
  "work (structures, vehicles, medical devices, process control) still go through the organisation's " +
  'own verification and validation and the standards and codes that apply there, under the ' +
  'responsibility of qualified engineers.';
