import { afterAll, beforeAll } from 'vitest';

/**
 * jsdom has no layout: every `offsetParent` is null and `<body>` measures 0 × 0, so Fluent's focus
 * manager (tabster) takes every element for hidden. A modal Dialog then never gets focus inside, its
 * modalizer never becomes active, and tabster marks the dialog itself `aria-hidden` — out of reach of
 * `getByRole`, as a browser never would. This gives tabster the little layout it reads (an offset parent
 * for what is displayed, a body with a size) for the test file that calls it.
 */
export function withFocusableLayout(): void {
  const offsetParent = Object.getOwnPropertyDescriptor(HTMLElement.prototype, 'offsetParent');
  const bodyRect = Object.getOwnPropertyDescriptor(HTMLBodyElement.prototype, 'getBoundingClientRect');
  beforeAll(() => {
    Object.defineProperty(HTMLElement.prototype, 'offsetParent', {
      configurable: true,
      get(this: HTMLElement) {
        return getComputedStyle(this).display === 'none' ? null : this.parentElement;
      },
    });
    Object.defineProperty(HTMLBodyElement.prototype, 'getBoundingClientRect', {
      configurable: true,
      value: () => new DOMRect(0, 0, 1280, 800),
    });
  });
  afterAll(() => {
    if (offsetParent) Object.defineProperty(HTMLElement.prototype, 'offsetParent', offsetParent);
    if (bodyRect) Object.defineProperty(HTMLBodyElement.prototype, 'getBoundingClientRect', bodyRect);
    else Reflect.deleteProperty(HTMLBodyElement.prototype, 'getBoundingClientRect');
  });
}
