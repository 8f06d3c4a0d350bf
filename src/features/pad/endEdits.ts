import { sortEndWithMarks, type ArrowValue } from '../../core';
import type { ArrowFlag } from '../../contract/sync';

export type EditableEnd = { arrows: ArrowValue[]; flags: { index: number; flag: ArrowFlag }[] };

type Arrow = { value: ArrowValue; flag?: ArrowFlag | undefined };

function explode(end: EditableEnd): Arrow[] {
  return end.arrows.map((value, index) => ({ value, flag: end.flags.find((f) => f.index === index)?.flag }));
}

/** Keeps values highest to lowest, and each flag on the arrow it was put on. */
function implode(arrows: Arrow[]): EditableEnd {
  const sorted = sortEndWithMarks(
    arrows.map((a) => a.value),
    arrows.flatMap((a, index) => (a.flag ? [{ index, flag: a.flag }] : [])),
  );
  return { arrows: sorted.values, flags: sorted.marks };
}

export const addArrow = (end: EditableEnd, value: ArrowValue): EditableEnd =>
  implode([...explode(end), { value }]);

export const removeArrow = (end: EditableEnd, index: number): EditableEnd =>
  implode(explode(end).filter((_, i) => i !== index));

export const changeArrow = (end: EditableEnd, index: number, value: ArrowValue): EditableEnd =>
  implode(explode(end).map((a, i) => (i === index ? { ...a, value } : a)));

/** Sets or clears (undefined) the flag on one arrow. */
export const flagArrow = (end: EditableEnd, index: number, flag: ArrowFlag | undefined): EditableEnd =>
  implode(explode(end).map((a, i) => (i === index ? { ...a, flag } : a)));
