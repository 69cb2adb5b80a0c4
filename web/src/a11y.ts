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

function mend(root: ParentNode): void {
  root
    .querySelectorAll<HTMLElement>('.ant-table-column-sorter .anticon[aria-label]')
    .forEach((icon) => mendSorterIcon(icon));
  root
    .querySelectorAll<HTMLElement>('input[role="combobox"], .ant-input-number input')
    .forEach((input) => mendInput(input));
  root
    .querySelectorAll<HTMLElement>('.ant-table-selection-column input.ant-checkbox-input')
    .forEach((input) => mendRowCheckbox(input));
  root
    .querySelectorAll<HTMLElement>('.ant-table-content, .ant-table-body')
    .forEach((el) => mendScroller(el));
}

/** Watches the page and mends what antd renders, as it renders it. */
export function installA11yMending(doc: Document = document): () => void {
  let queued = false;
  const run = () => {
    queued = false;
    mend(doc);
  };
  const observer = new MutationObserver(() => {
    if (queued) return;
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
