/**
 * The graph work under the engine's order, on cells as indices: strongly connected
 * components (the cells that read each other in a ring), the shortest ring through a cell
 * for the message that names it, and a small heap that keeps the order close to the
 * document's own. Pure; no cells, no values.
 */

/** Tarjan's strongly connected components, iteratively (no recursion on long chains). */
export function tarjan(succ: readonly (readonly number[])[]): number[] {
  const n = succ.length;
  const index = new Int32Array(n).fill(-1);
  const low = new Int32Array(n);
  const onStack = new Uint8Array(n);
  const comp = new Array<number>(n).fill(-1);
  const stack: number[] = [];
  let counter = 0;
  let compCount = 0;
  const work: { v: number; i: number }[] = [];
  for (let s = 0; s < n; s++) {
    if (index[s] !== -1) continue;
    work.push({ v: s, i: 0 });
    index[s] = low[s] = counter++;
    stack.push(s);
    onStack[s] = 1;
    while (work.length > 0) {
      const top = work[work.length - 1]!;
      const edges = succ[top.v]!;
      if (top.i < edges.length) {
        const w = edges[top.i++]!;
        if (index[w] === -1) {
          index[w] = low[w] = counter++;
          stack.push(w);
          onStack[w] = 1;
          work.push({ v: w, i: 0 });
        } else if (onStack[w]) low[top.v] = Math.min(low[top.v]!, index[w]!);
        continue;
      }
      work.pop();
      if (work.length > 0) {
        const parent = work[work.length - 1]!.v;
        low[parent] = Math.min(low[parent]!, low[top.v]!);
      }
      if (low[top.v] === index[top.v]) {
        for (;;) {
          const w = stack.pop()!;
          onStack[w] = 0;
          comp[w] = compCount;
          if (w === top.v) break;
        }
        compCount++;
      }
    }
  }
  return comp;
}

/** A shortest cycle from `start` back to itself inside one component, as cell indices. */
export function cyclePath(start: number, succ: readonly (readonly number[])[], inComp: ReadonlySet<number>): number[] {
  const prev = new Map<number, number>();
  const queue: number[] = [start];
  let found = false;
  for (let head = 0; head < queue.length && !found; head++) {
    const v = queue[head]!;
    for (const w of succ[v]!) {
      if (!inComp.has(w)) continue;
      if (w === start) {
        prev.set(start, v);
        found = true;
        break;
      }
      if (!prev.has(w)) {
        prev.set(w, v);
        queue.push(w);
      }
    }
  }
  // walk back from start's predecessor to start; edges are definer -> reader, so the
  // path read backwards is "reader needs definer": start reads prev(start) ...
  const path: number[] = [start];
  let v = prev.get(start);
  while (v !== undefined && v !== start) {
    path.push(v);
    v = prev.get(v);
  }
  path.push(start);
  return path;
}

/** A small binary min-heap of numbers. */
export class MinHeap {
  private readonly a: number[];
  constructor(items: number[]) {
    this.a = [];
    for (const x of items) this.push(x);
  }
  get size(): number {
    return this.a.length;
  }
  push(x: number): void {
    const a = this.a;
    a.push(x);
    let i = a.length - 1;
    while (i > 0) {
      const p = (i - 1) >> 1;
      if (a[p]! <= a[i]!) break;
      [a[p], a[i]] = [a[i]!, a[p]!];
      i = p;
    }
  }
  pop(): number {
    const a = this.a;
    const top = a[0]!;
    const last = a.pop()!;
    if (a.length > 0) {
      a[0] = last;
      let i = 0;
      for (;;) {
        const l = 2 * i + 1;
        const r = l + 1;
        let m = i;
        if (l < a.length && a[l]! < a[m]!) m = l;
        if (r < a.length && a[r]! < a[m]!) m = r;
        if (m === i) break;
        [a[m], a[i]] = [a[i]!, a[m]!];
        i = m;
      }
    }
    return top;
  }
}
