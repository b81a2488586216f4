/**
 * Boxes of every chart's labelled texts on the page (tick labels, axis titles, legend entries, chart
 * title, notes), and the checks on them: no two overlap, none leaves its chart. Used by the layout
 * test on every demo and by the tests of single charts (test/browser/run-rules.test.ts).
 */
export interface Box {
  readonly kind: string;
  readonly text: string;
  readonly x: number;
  readonly y: number;
  readonly w: number;
  readonly h: number;
}

export interface ChartBoxes {
  readonly title: string;
  readonly svg: Box;
  readonly boxes: Box[];
}

/**
 * Every labelled text of every chart on the page, with its box on screen. Runs in the page. A
 * chart not on show (another evidence view, a folded section) is measured on a visible copy at
 * its drawn size, so every chart is checked whatever the page shows.
 */
export function collectBoxes(): ChartBoxes[] {
  const box = (el: Element, kind: string): Box => {
    const r = el.getBoundingClientRect();
    return { kind, text: (el.textContent ?? '').trim().slice(0, 60), x: r.x, y: r.y, w: r.width, h: r.height };
  };
  const stage = document.createElement('div');
  stage.style.cssText = 'position:absolute;left:0;top:0;z-index:99999;background:#fff';
  document.body.append(stage);
  const svgs = [...document.querySelectorAll('svg[role="img"]')].map((svg) => {
    if (svg.getBoundingClientRect().width > 0) return svg;
    const copy = svg.cloneNode(true) as SVGSVGElement;
    stage.append(copy);
    return copy;
  });
  const out = svgs.map((svg) => {
      const boxes: Box[] = [];
      for (const t of svg.querySelectorAll('.tick text')) if ((t.textContent ?? '') !== '') boxes.push(box(t, 'tick'));
      for (const t of svg.querySelectorAll('[data-kind="axis-title"]')) boxes.push(box(t, 'axis-title'));
      for (const t of svg.querySelectorAll('[data-kind="legend-entry"]')) boxes.push(box(t, 'legend'));
      for (const t of svg.querySelectorAll('[data-kind="chart-title"]')) boxes.push(box(t, 'title'));
      for (const t of svg.querySelectorAll('[data-kind="notes"] text, [data-kind="region-label"], [data-kind="empty-note"]')) boxes.push(box(t, 'note'));
    return { title: svg.querySelector('title')?.textContent ?? '', svg: box(svg, 'svg'), boxes };
  });
  stage.remove();
  return out;
}

/** Pairs of boxes that overlap by more than `slack` px in both directions. */
export function overlaps(boxes: readonly Box[], slack = 0.5): string[] {
  const out: string[] = [];
  for (let i = 0; i < boxes.length; i++) {
    for (let j = i + 1; j < boxes.length; j++) {
      const a = boxes[i]!;
      const b = boxes[j]!;
      const dx = Math.min(a.x + a.w, b.x + b.w) - Math.max(a.x, b.x);
      const dy = Math.min(a.y + a.h, b.y + b.h) - Math.max(a.y, b.y);
      if (dx > slack && dy > slack) out.push(`${a.kind} "${a.text}" overlaps ${b.kind} "${b.text}" (${dx.toFixed(1)} × ${dy.toFixed(1)} px)`);
    }
  }
  return out;
}

export function outside(svg: Box, boxes: readonly Box[], slack = 1): string[] {
  return boxes
    .filter((b) => b.x < svg.x - slack || b.y < svg.y - slack || b.x + b.w > svg.x + svg.w + slack || b.y + b.h > svg.y + svg.h + slack)
    .map((b) => `${b.kind} "${b.text}" leaves its chart`);
}
