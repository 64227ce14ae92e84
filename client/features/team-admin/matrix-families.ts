import { familySlugs } from '@shared/matrix-families.ts';

/**
 * Family names the engine generates, offered as suggestions only: the server checks every recipe
 * and says what is wrong with a bad one.
 */
export const suggestedFamilies = familySlugs;
