// Gaps in ant-design-vue's own markup that no prop reaches, mended once for the whole app
// (WCAG 2.2 AA; the e2e test tests/e2e/a11y.test.ts runs axe-core on every page):
// - a select's search input is role="combobox" but has no aria-expanded until first opened, and
//   points aria-owns / aria-activedescendant at a list that is not in the page until then;
// - a select takes its aria-label on its outer box, not on the combobox a screen reader reads;
//   the page-size select of a table's pagination has no name at all;
// - a table that scrolls sideways is a region a keyboard cannot reach without a Tab stop;
// - a table's row-selection checkbox has no name: it takes the row's first figure ("Choose v2");
// - a sortable column's caret icons carry aria-label on a span with no role (the header cell
//   already says how it is sorted, with aria-sort).
// Everything here only adds or drops ARIA/tabindex attributes; Vue still owns the elements.

const PAGE_SIZE_NAME = 'Rows per page';

function mendInput(input: HTMLElement): void {
  if (input.getAttribute('role') === 'combobox') {
    if (!input.hasAttribute('aria-expanded')) input.setAttribute('aria-expanded', 'false');
    for (const attr of ['aria-owns', 'aria-activedescendant']) {
      const ref = input.getAttribute(attr);
      if (ref && !document.getElementById(ref)) input.removeAttribute(attr);
    }
  }
  if (input.hasAttribute('aria-label') || input.hasAttribute('aria-labelledby')) return;
  if (input.id && document.querySelector(`label[for="${CSS.escape(input.id)}"]`)) return;
  const box = input.closest('.ant-select, .ant-input-number');
  const name =
    box?.getAttribute('aria-label') ??
    (input.closest('.ant-pagination-options') ? PAGE_SIZE_NAME : null);
  if (name) input.setAttribute('aria-label', name);
}

function mendRowCheckbox(input: HTMLElement): void {
  if (input.hasAttribute('aria-label') || input.hasAttribute('aria-labelledby')) return;
  const row = input.closest('tr');
  const first = row?.querySelector('td:not(.ant-table-selection-column)')?.textContent?.trim();
  input.setAttribute('aria-label', first ? `Choose ${first}` : 'Choose this row');
}

function mendScroller(el: HTMLElement): void {
  if (el.hasAttribute('tabindex')) return;
  if (el.scrollWidth > el.clientWidth + 1) {
    el.setAttribute('tabindex', '0');
    const table = el.closest('.ant-table-wrapper');
    const name = table?.getAttribute('aria-label') ?? 'Table (scrolls sideways)';
    el.setAttribute('role', 'region');
    el.setAttribute('aria-label', name);
  }
}

function mendSorterIcon(icon: HTMLElement): void {
  icon.removeAttribute('aria-label');
  icon.setAttribute('aria-hidden', 'true');
}

const SORTER_ICON = '.ant-table-column-sorter .anticon[aria-label]';
const INPUT = 'input[role="combobox"], .ant-input-number input';
const ROW_CHECKBOX = '.ant-table-selection-column input.ant-checkbox-input';
const SCROLLER = '.ant-table-content, .ant-table-body';

/** Elements matching `selector` at or under `root`. */
function within(root: Element | Document, selector: string): HTMLElement[] {
  const under = [...root.querySelectorAll<HTMLElement>(selector)];
  return root instanceof Element && root.matches(selector)
    ? [root as HTMLElement, ...under]
    : under;
}

function mend(root: Element | Document): void {
  within(root, SORTER_ICON).forEach((icon) => mendSorterIcon(icon));
  within(root, INPUT).forEach((input) => mendInput(input));
  within(root, ROW_CHECKBOX).forEach((input) => mendRowCheckbox(input));
  within(root, SCROLLER).forEach((el) => mendScroller(el));
}

/**
 * Watches the page and mends what antd renders, as it renders it: only the parts that changed,
 * once a frame (a whole-page pass on every change held the main thread on long pages).
 */
export function installA11yMending(doc: Document = document): () => void {
  const changed = new Set<Element>(); // added, or an attribute changed: mended with what is under it
  const grown = new Set<Element>(); // children added or removed: its table may now scroll sideways
  let queued = false;
  const underAnother = (el: Element): boolean => {
    for (let up = el.parentElement; up; up = up.parentElement) if (changed.has(up)) return true;
    return false;
  };
  const run = () => {
    queued = false;
    for (const root of changed) if (root.isConnected && !underAnother(root)) mend(root);
    for (const el of grown) {
      const scroller = el.isConnected ? el.closest<HTMLElement>(SCROLLER) : null;
      if (scroller) mendScroller(scroller);
    }
    changed.clear();
    grown.clear();
  };
  const observer = new MutationObserver((records) => {
    for (const r of records) {
      if (r.type === 'attributes') {
        if (r.target instanceof Element) changed.add(r.target);
        continue;
      }
      r.addedNodes.forEach((n) => {
        if (n instanceof Element) changed.add(n);
      });
      if (r.target instanceof Element) grown.add(r.target);
    }
    if (queued || changed.size + grown.size === 0) return;
    queued = true;
    requestAnimationFrame(run);
  });
  observer.observe(doc.body, {
    subtree: true,
    childList: true,
    attributes: true,
    attributeFilter: ['aria-expanded', 'aria-owns', 'aria-activedescendant', 'aria-label', 'class'],
  });
  const onResize = () => mend(doc);
  window.addEventListener('resize', onResize);
  mend(doc);
  return () => {
    observer.disconnect();
    window.removeEventListener('resize', onResize);
  };
}
