import { describe, expect, it } from 'vitest';
import { decodeMappingMemory, encodeMappingMemory, mappingMemoryKey } from '../../../lib/checkups/mappingMemory';

describe('mapping memory', () => {
  it('keys by the headers only, whatever their case', () => {
    expect(mappingMemoryKey(['Worker', 'A1C'])).toBe(mappingMemoryKey(['worker', 'a1c']));
    expect(mappingMemoryKey(['Worker', 'A1C'])).not.toBe(mappingMemoryKey(['A1C', 'Worker']));
    expect(mappingMemoryKey(['Worker'])).toMatch(/^hundredfold\.checkups\.columns\./);
  });

  it('reads back what it wrote, and refuses anything else', () => {
    expect(decodeMappingMemory(encodeMappingMemory(['worker', null, 'hba1c']), 3)).toEqual(['worker', null, 'hba1c']);
    expect(decodeMappingMemory(encodeMappingMemory(['worker']), 2)).toBeNull();
    expect(decodeMappingMemory('["name"]', 1)).toBeNull();
    expect(decodeMappingMemory('not json', 1)).toBeNull();
    expect(decodeMappingMemory(null, 1)).toBeNull();
  });
});
