import { resolve } from 'node:path';
import { describe, expect, it } from 'vitest';
import { firstLoadChunkOf } from '../../scripts/firstLoadChunks';

const src = (path: string) => resolve('src', path);
const ENTRY = src('main.tsx');
const LAYOUT = src('app/AppLayout.tsx');
const PAD = src('features/pad/PadScreen.tsx');
const PRACTICE = src('features/practice/PracticeArea.tsx');
const RESULTS = src('features/results/ResultsScreen.tsx');
const DESK = src('features/desk/JudgeDeskScreen.tsx');

/** A small module graph: id → what it imports statically. */
const graph: Record<string, string[]> = {
  [ENTRY]: ['react'],
  [LAYOUT]: ['dexie', 'outbox', 'core'],
  [PAD]: ['outbox', 'padOnly', 'keypad', 'core'],
  [PRACTICE]: ['keypad', 'practiceOnly'],
  [RESULTS]: ['core', 'resultsOnly'],
  [DESK]: ['deskOnly', 'padOnly'],
  padOnly: ['dexie'],
};
const ctx = { getModuleInfo: (id: string) => ({ importedIds: graph[id] ?? [] }) };

describe('the first-load chunk groups', () => {
  const chunkOf = firstLoadChunkOf();
  const named = (id: string) => chunkOf(id, ctx);

  it("put the layout's modules together, the database with them", () => {
    expect(named('dexie')).toBe('layout');
    expect(named('outbox')).toBe('layout');
  });

  it("put what only the pad adds in the pad's chunk", () => {
    expect(named('padOnly')).toBe('pad');
  });

  it('put what the pad shares with the practice log in the layout, which the practice log loads anyway', () => {
    // In the pad's group the practice log would load the pad's code.
    expect(named('keypad')).toBe('layout');
  });

  it("put what a spectator's page shares with the pad in a chunk of its own, never with the database", () => {
    expect(named('core')).toBe('common');
  });

  it('leave to the bundler the entry, the screens, and what the pad does not load', () => {
    expect(named('react')).toBeNull();
    expect(named(PAD)).toBeNull();
    expect(named(LAYOUT)).toBeNull();
    expect(named('practiceOnly')).toBeNull();
    expect(named('resultsOnly')).toBeNull();
    expect(named('deskOnly')).toBeNull();
  });
});
