/** Unit roundoff of IEEE double precision, u = 2⁻⁵³ (IEEE 754-2008, binary64; Higham, Accuracy and Stability of Numerical Algorithms, 2nd ed., §2.1). */
export const unitRoundoff = 2 ** -53;
