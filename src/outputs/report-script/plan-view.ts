// The HTML report's one script, typed and bundled by Vite into report-script.generated.ts: zoom and pan of the
// plan, and finding rows and plan markers that highlight each other. It loads nothing; the report's CSP names it.

/**
 * Zoom and pan: during a gesture the drawn plan moves by a CSS transform (composited, nothing redrawn); when it
 * pauses, the transform becomes the viewBox, so a plan of 20,000 heads stays smooth.
 */
function planView(svg: SVGSVGElement): { fitTo(x: number, y: number, w: number, h: number): void; fitAll(): void; size: number } {
  const box = svg.parentElement!;
  const W = Number(svg.dataset['w']);
  const H = Number(svg.dataset['h']);
  let vb = [0, 0, W, H];
  let k = 1;
  let tx = 0;
  let ty = 0;
  let timer = 0;
  const aspect = () => {
    const r = box.getBoundingClientRect();
    return r.height > 0 ? r.width / r.height : 1;
  };
  const commit = () => {
    svg.setAttribute('viewBox', vb.join(' '));
    k = 1;
    tx = 0;
    ty = 0;
    svg.style.transform = '';
  };
  const fitTo = (x: number, y: number, w: number, h: number) => {
    const a = aspect();
    if (w / h < a) {
      x -= (h * a - w) / 2;
      w = h * a;
    } else {
      y -= (w / a - h) / 2;
      h = w / a;
    }
    vb = [x, y, w, h];
    commit();
  };
  const settle = () => {
    const s = box.getBoundingClientRect().width / vb[2]!;
    vb = [vb[0]! - tx / (k * s), vb[1]! - ty / (k * s), vb[2]! / k, vb[3]! / k];
    commit();
  };
  const move = () => {
    svg.style.transform = `translate(${tx}px,${ty}px) scale(${k})`;
    clearTimeout(timer);
    timer = window.setTimeout(settle, 160);
  };
  box.addEventListener(
    'wheel',
    (e) => {
      e.preventDefault();
      const r = box.getBoundingClientRect();
      const cx = e.clientX - r.left;
      const cy = e.clientY - r.top;
      const f = e.deltaY < 0 ? 1.25 : 0.8;
      k *= f;
      tx = cx - (cx - tx) * f;
      ty = cy - (cy - ty) * f;
      move();
    },
    { passive: false },
  );
  let drag: [number, number] | null = null;
  box.addEventListener('pointerdown', (e) => {
    drag = [e.clientX - tx, e.clientY - ty];
    box.setPointerCapture(e.pointerId);
  });
  box.addEventListener('pointermove', (e) => {
    if (!drag) return;
    tx = e.clientX - drag[0];
    ty = e.clientY - drag[1];
    move();
  });
  box.addEventListener('pointerup', () => {
    drag = null;
  });
  const fitAll = () => fitTo(0, 0, W, H);
  return { fitTo, fitAll, size: Math.max(W, H) };
}

/** Finding rows and plan markers highlight each other; a row's marker is zoomed to. */
function linkFindings(svg: SVGSVGElement, view: ReturnType<typeof planView>): void {
  const highlight = (i: string) => {
    for (const x of document.querySelectorAll('.hl')) x.classList.remove('hl');
    const marker = svg.querySelector(`.marker[data-finding="${i}"]`);
    const row = document.querySelector(`tr[data-finding="${i}"]`);
    if (marker) {
      marker.classList.add('hl');
      const s = view.size / 3;
      view.fitTo(Number(marker.getAttribute('cx')) - s / 2, Number(marker.getAttribute('cy')) - s / 2, s, s);
    }
    row?.classList.add('hl');
  };
  for (const row of document.querySelectorAll<HTMLElement>('tr[data-finding]')) {
    row.addEventListener('click', () => {
      highlight(row.dataset['finding']!);
      svg.parentElement!.scrollIntoView({ block: 'nearest' });
    });
    row.addEventListener('keydown', (e) => {
      if (e.key === 'Enter') highlight(row.dataset['finding']!);
    });
  }
  for (const marker of svg.querySelectorAll<SVGElement>('.marker')) {
    marker.addEventListener('click', (e) => {
      e.stopPropagation();
      highlight(marker.dataset['finding']!);
      document.querySelector(`tr[data-finding="${marker.dataset['finding']}"]`)?.scrollIntoView({ block: 'center' });
    });
  }
}

const svg = document.getElementById('plan') as SVGSVGElement | null;
if (svg) {
  const view = planView(svg);
  document.getElementById('fit')?.addEventListener('click', view.fitAll);
  view.fitAll();
  linkFindings(svg, view);
}
