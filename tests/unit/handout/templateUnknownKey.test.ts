import { describe, expect, it } from 'vitest';
import { DEFAULT_BLOCKS } from '@/lib/handout';
import { parseTemplateFile, TEMPLATE_FILE_FORMAT, TEMPLATE_FILE_VERSION } from '@/lib/handout/template';

// Issue 14 item 16: an unknown key inside a template's clinic is named with "clinic".
describe('template file: an unknown key in clinic', () => {
  it('names the template, clinic and the key', () => {
    const file = JSON.stringify({
      format: TEMPLATE_FILE_FORMAT,
      version: TEMPLATE_FILE_VERSION,
      templates: [{ name: 'Clinic A', blocks: DEFAULT_BLOCKS, clinic: { name: 'A', phone: '123' } }],
    });
    const r = parseTemplateFile(file);
    expect(r.ok).toBe(false);
    if (!r.ok) {
      expect(r.issues[0]).toMatchObject({ code: 'unknown-field', path: ['templates', 0, 'clinic', 'phone'] });
      expect(r.issues[0]?.message).toMatch(/^Template 1 \("Clinic A"\), clinic: "phone" is not a field here/);
    }
  });
});
