/**
 * What the page says when the app's own code could not be loaded at start-up (a script missing after a
 * release, the connection dropping on the way): React may not be there, so this is plain DOM, drawn
 * into the loading frame of index.html in place of its placeholder blocks. The one way on is a reload.
 * Statically imported by main.tsx, so it is part of the entry and there whatever else failed.
 */

const svgNs = 'http://www.w3.org/2000/svg';

function el<K extends keyof HTMLElementTagNameMap>(
  tag: K,
  className: string,
  text?: string,
): HTMLElementTagNameMap[K] {
  const node = document.createElement(tag);
  node.className = className;
  if (text !== undefined) node.textContent = text;
  return node;
}

/** An icon of components/ui/icon.tsx, drawn without React. */
function icon(paths: Array<Record<string, string>>, className: string): SVGSVGElement {
  const svg = document.createElementNS(svgNs, 'svg');
  for (const [name, value] of Object.entries({
    viewBox: '0 0 24 24',
    fill: 'none',
    stroke: 'currentColor',
    'stroke-width': '2',
    'stroke-linecap': 'round',
    'stroke-linejoin': 'round',
    'aria-hidden': 'true',
    focusable: 'false',
    class: className,
  }))
    svg.setAttribute(name, value);
  for (const { tag = 'path', ...attributes } of paths) {
    const shape = document.createElementNS(svgNs, tag);
    for (const [name, value] of Object.entries(attributes)) shape.setAttribute(name, value);
    svg.append(shape);
  }
  return svg;
}

function failureMessage(): HTMLElement {
  const isOffline = typeof navigator !== 'undefined' && navigator.onLine === false;
  const box = el(
    'div',
    'flex flex-col items-center rounded-card border-2 border-fail/40 bg-fail-soft px-5 py-7 text-center',
  );
  box.id = 'start-failure';
  box.setAttribute('role', 'alert');
  box.append(
    icon(
      [{ tag: 'circle', cx: '12', cy: '12', r: '9' }, { d: 'm8.5 8.5 7 7M15.5 8.5l-7 7' }],
      'mb-3 size-10 shrink-0 text-fail',
    ),
    el('h1', 'font-display text-xl font-semibold text-ink', 'Stringfield did not start'),
    el(
      'p',
      'mt-2 max-w-prose text-ink',
      isOffline
        ? 'This device is offline and part of the app is not on it yet. Connect to the internet, then reload.'
        : 'Part of the app did not download. This can happen just after an update or when the connection drops. Reloading usually fixes it.',
    ),
    el('p', 'mt-2 max-w-prose text-sm text-ink-muted', 'Readings saved on this device are kept.'),
  );
  const reload = el(
    'button',
    'mt-5 inline-flex min-h-14 w-full items-center justify-center gap-2 rounded-control bg-brand px-6 text-lg font-semibold text-on-brand shadow-card select-none hover:bg-brand-strong active:bg-brand-strong sm:w-auto',
  );
  reload.type = 'button';
  reload.append(
    icon(
      [
        { d: 'M20 11a8 8 0 0 0-14.3-4.3L4 9' },
        { d: 'M4 4v5h5M4 13a8 8 0 0 0 14.3 4.3L20 15' },
        { d: 'M20 20v-5h-5' },
      ],
      'size-5 shrink-0',
    ),
    document.createTextNode('Reload'),
  );
  reload.addEventListener('click', () => window.location.reload());
  box.append(reload);
  return box;
}

/**
 * Replaces the loading frame's placeholder with the failure message (once). `isReactRendering`: React
 * owns #root already, so the message goes in a layer of its own over the page instead.
 */
export function showStartFailure(error: unknown, { isReactRendering = false } = {}): void {
  console.error('Stringfield did not start', error);
  if (document.getElementById('start-failure')) return;
  const message = failureMessage();
  const frame = isReactRendering ? null : document.querySelector('#root > [role="status"]');
  const placeholder = frame?.querySelector(':scope > .mx-auto');
  if (frame && placeholder) {
    // No longer "loading": the frame stops being a live status region, and its hidden label goes.
    frame.removeAttribute('role');
    frame.removeAttribute('aria-live');
    frame.querySelector(':scope > .sr-only')?.remove();
    placeholder.replaceChildren(message);
  } else {
    const layer = el(
      'div',
      'fixed inset-0 z-50 flex items-center justify-center overflow-y-auto bg-paper px-4 py-6',
    );
    const column = el('div', 'w-full max-w-lg');
    column.append(message);
    layer.append(column);
    document.body.append(layer);
  }
  message.querySelector('button')?.focus();
}
