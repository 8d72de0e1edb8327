import type { FieldIssue } from '../common/domain-errors';

export interface BodyRef {
  id: string;
  name: string;
}

/**
 * Fits of different bodies cannot be combined: a joint ring pole, a 3D shape or a comparison mixes sizes,
 * rings and poles that have nothing to do with each other. One issue per item that does not observe the
 * expected body (or, with none expected, the first item's body), each naming its field.
 */
export function oneBodyIssues(
  items: Array<{ path: string; body: BodyRef }>,
  expected?: BodyRef,
): FieldIssue[] {
  const first = items[0];
  const reference = expected ?? first?.body;
  if (reference === undefined) return [];
  return items
    .filter((item) => item.body.id !== reference.id)
    .map((item) => ({
      path: item.path,
      message:
        expected !== undefined
          ? `a fit of ${item.body.name}, not of ${reference.name}: fits of different bodies cannot be combined`
          : `a fit of ${item.body.name}, while ${first?.path ?? 'the first'} is of ${reference.name}: fits of different bodies cannot be combined`,
    }));
}
