import { resolve } from 'node:path';
import { describe, expect, it } from 'vitest';
import { firstLoadChunkOf } from '../../scripts/firstLoadChunks';

const src = (path: string) => resolve('src', path);
const ENTRY = src('main.tsx');
const LAYOUT = src('app/AppLayout.tsx');
const PAD = src('features/pad/PadScreen.tsx');
const PRACTICE = src('features/practice/PracticeArea.tsx');
const RESULTS = src('features/results/ResultsScreen.tsx');

/** A small module graph: id → what it imports statically. */
const graph: Record<string, string[]> = {
  [ENTRY]: ['react'],
  [LAYOUT]: ['dexie', 'outbox', 'core'],
  [PAD]: ['outbox', 'padOnly', 'keypad', 'core'],
  [PRACTICE]: ['keypad'],
  [RESULTS]: ['core'],
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

  it('leave to the bundler what the practice log or public pages also load, and the screens themselves', () => {
    // In the pad's group the practice log would load the pad's code; in the layout's, a
    // spectator's page would load the phone's database.
    expect(named('keypad')).toBeNull();
    expect(named('core')).toBeNull();
    expect(named('react')).toBeNull();
    expect(named(PAD)).toBeNull();
    expect(named(LAYOUT)).toBeNull();
  });
});
