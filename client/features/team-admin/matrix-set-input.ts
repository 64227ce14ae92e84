import type {
  MatrixSetDetail,
  MatrixSetInput,
  MatrixSetItem,
  MatrixSetItemInput,
} from '@shared/api/matrix-sets.ts';

/** A stored item as the API takes it back (PUT replaces the whole set). */
export function itemInput(item: MatrixSetItem): MatrixSetItemInput {
  if (item.kind === 'upload' && item.uploadId !== null)
    return { kind: 'upload', uploadId: item.uploadId };
  return {
    kind: 'generated',
    family: item.family ?? '',
    n: item.n ?? item.cols,
    ...(item.m !== null ? { m: item.m } : {}),
    ...(item.seed !== null ? { seed: item.seed } : {}),
    ...(item.params !== null ? { params: item.params } : {}),
  };
}

/** The set as it is, with one more item at the end. */
export function withItem(set: MatrixSetDetail, extra: MatrixSetItemInput): MatrixSetInput {
  return {
    name: set.name,
    description: set.description,
    timingSizes: set.timingSizes,
    items: [...set.items.map(itemInput), extra],
  };
}
