import { describe, expect, it } from 'vitest';
describe('skeleton', () => { it('runs', () => { expect(1 + 1).toBe(2); }); });
