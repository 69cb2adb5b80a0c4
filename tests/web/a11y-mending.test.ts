// web/src/a11y.ts mends antd's ARIA gaps as antd renders (WCAG 2.2 AA, 4.1.2 Name, Role,
// Value): it looks only at what changed, so a part added after the page first rendered is
// mended in the next frame, and what was there before is left as it was.
import { afterEach, describe, expect, it } from 'vitest';
import { installA11yMending } from '../../web/src/a11y';

const frame = (): Promise<void> => new Promise((resolve) => requestAnimationFrame(() => resolve()));
/** Until `check` holds, a frame at a time (mending runs in the frame after a change). */
async function until(check: () => boolean): Promise<void> {
  while (!check()) await frame();
}

// jsdom has no CSS.escape (every browser has): enough of it for the ids used here.
if (typeof globalThis.CSS === 'undefined')
  (globalThis as { CSS?: { escape: (s: string) => string } }).CSS = {
    escape: (s) => s.replace(/[^\w-]/g, '\\$&'),
  };

let stop: (() => void) | undefined;
afterEach(() => {
  stop?.();
  document.body.innerHTML = '';
});

describe('installA11yMending', () => {
  it('names a select’s combobox from its box, marks it collapsed and drops a dangling aria-owns', () => {
    document.body.innerHTML =
      '<div class="ant-select" aria-label="Debris"><input role="combobox" aria-owns="gone"></div>';
    stop = installA11yMending();
    const input = document.querySelector('input')!;
    expect(input.getAttribute('aria-label')).toBe('Debris');
    expect(input.getAttribute('aria-expanded')).toBe('false');
    expect(input.hasAttribute('aria-owns')).toBe(false);
  });

  it('mends a part added later: a table’s row checkbox takes the row’s first figure, a sorter icon is hidden', async () => {
    document.body.innerHTML = '<main></main>';
    stop = installA11yMending();
    const table = document.createElement('table');
    table.innerHTML =
      '<thead><tr><th><span class="ant-table-column-sorter"><span class="anticon" aria-label="caret-up"></span></span></th></tr></thead>' +
      '<tbody><tr><td class="ant-table-selection-column"><input type="checkbox" class="ant-checkbox-input"></td><td>v2</td></tr></tbody>';
    document.querySelector('main')!.append(table);
    const box = table.querySelector('input')!;
    await until(() => box.hasAttribute('aria-label'));
    expect(box.getAttribute('aria-label')).toBe('Choose v2');
    const icon = table.querySelector('.anticon')!;
    expect(icon.hasAttribute('aria-label')).toBe(false);
    expect(icon.getAttribute('aria-hidden')).toBe('true');
  });

  it('a number box added inside an existing form takes the name its antd box carries', async () => {
    document.body.innerHTML = '<form><div id="slot"></div></form>';
    stop = installA11yMending();
    const slot = document.getElementById('slot')!;
    slot.innerHTML = '<div class="ant-input-number" aria-label="Seats"><input></div>';
    const input = slot.querySelector('input')!;
    await until(() => input.hasAttribute('aria-label'));
    expect(input.getAttribute('aria-label')).toBe('Seats');
  });

  it('a box with its own label is left alone', async () => {
    document.body.innerHTML =
      '<label for="own">Own name</label><div class="ant-input-number" aria-label="Other"><input id="own"></div>';
    stop = installA11yMending();
    await frame();
    expect(document.getElementById('own')!.hasAttribute('aria-label')).toBe(false);
  });
});
