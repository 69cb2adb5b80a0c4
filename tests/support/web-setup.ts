// jsdom lacks a few browser APIs that ant-design-vue relies on; these stand-ins behave like a
// desktop browser with no media-query matches and no layout.
import { config } from '@vue/test-utils';
import Antd from 'ant-design-vue';
import { afterEach } from 'vitest';

if (!window.matchMedia) {
  window.matchMedia = (query: string): MediaQueryList => ({
    matches: false,
    media: query,
    onchange: null,
    addListener: () => {},
    removeListener: () => {},
    addEventListener: () => {},
    removeEventListener: () => {},
    dispatchEvent: () => false,
  });
}

if (!('ResizeObserver' in window)) {
  class ResizeObserverStandIn {
    observe(): void {}
    unobserve(): void {}
    disconnect(): void {}
  }
  Object.defineProperty(window, 'ResizeObserver', { value: ResizeObserverStandIn, writable: true });
  Object.defineProperty(globalThis, 'ResizeObserver', {
    value: ResizeObserverStandIn,
    writable: true,
  });
}

// jsdom does not compute styles of pseudo-elements and logs "Not implemented" for them.
const computeStyle = window.getComputedStyle.bind(window);
window.getComputedStyle = (element: Element) => computeStyle(element);

window.scrollTo = () => {};
if (!Element.prototype.scrollIntoView) Element.prototype.scrollIntoView = () => {};

// The app registers antd components on demand at build time; in tests they are registered
// globally under the same a-* tag names.
config.global.plugins = [...config.global.plugins, Antd];

afterEach(() => {
  localStorage.clear();
  document.body.innerHTML = '';
});
