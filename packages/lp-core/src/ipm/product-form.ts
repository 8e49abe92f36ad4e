/**
 * Product-form updates of a basis (B_new⁻¹ = E⁻¹ B⁻¹, one eta column per exchange) and the two
 * ways they are applied. The basis keeps them by position (basis-preconditioner.ts); the split
 * system keeps a copy with positions renumbered as rows (split-system.ts).
 */

/** update e: pivot pivot[e] at pos[e], its other entries idx/val[ptr[e] .. ptr[e + 1]) */
export interface UpdateFile {
  count: number;
  pos: Int32Array;
  pivot: Float64Array;
  ptr: Int32Array;
  idx: Int32Array;
  val: Float64Array;
}

/** y ← E⁻¹y */
export function applyUpdates(f: UpdateFile, y: Float64Array<ArrayBufferLike>): void {
  const { pos, pivot, ptr, idx, val } = f;
  for (let e = 0; e < f.count; e++) {
    const k = pos[e];
    const t = y[k] / pivot[e];
    y[k] = t;
    if (t === 0) continue;
    for (let p = ptr[e]; p < ptr[e + 1]; p++) y[idx[p]] -= val[p] * t;
  }
}

/** y ← E⁻ᵀy */
export function applyUpdatesTransposed(f: UpdateFile, y: Float64Array<ArrayBufferLike>): void {
  const { pos, pivot, ptr, idx, val } = f;
  for (let e = f.count - 1; e >= 0; e--) {
    const k = pos[e];
    let s = y[k];
    for (let p = ptr[e]; p < ptr[e + 1]; p++) s -= val[p] * y[idx[p]];
    y[k] = s / pivot[e];
  }
}
