/**
 * Approximate minimum degree ordering on the quotient graph, after
 * P. R. Amestoy, T. A. Davis and I. S. Duff, "An approximate minimum degree ordering
 * algorithm", SIAM J. Matrix Anal. Appl. 17(4), 1996, and Algorithm 837 (ACM TOMS 30(3), 2004).
 *
 * The graph of a symmetric n × n pattern is kept as a quotient graph in one integer workspace
 * iw: each variable i has a list pe[i]..pe[i]+len[i]−1 whose first elen[i] entries are the
 * elements (eliminated cliques) it touches and the rest are variables; each element e has the
 * list of variables of its clique. Eliminating the variable of least approximate degree turns
 * it into a new element Lme that absorbs the elements it touched. Degrees are bounded by the
 * AMD bound d(i) ≤ |A_i \ i| + |Lme \ i| + Σ_e |Le \ Lme|; indistinguishable variables are merged
 * into supervariables (detected by hashing), and elements covered by Lme are absorbed
 * (aggressive absorption). Rows denser than 10·√n are ordered last.
 */

const EMPTY = -1;
const flip = (i: number): number => -i - 2;

/** Fill-reducing ordering of a symmetric pattern (either triangle or both may be given; the diagonal is ignored). perm[k] = original index placed k-th. */
export function approximateMinimumDegree(n: number, Ap: Int32Array, Ai: Int32Array): Int32Array {
  return minimumDegreeOrder(n, Ap, Ai, Infinity)!;
}

/**
 * The order of approximateMinimumDegree, or null once the factor's multiply–adds in that order,
 * Σ_j (entries of column j of L)², reach flopLimit: each pivot's element Lme is its column's
 * pattern (a supervariable of f columns adds Σ_{k=r+1}^{r+f} k², r = |Lme|). The rows set aside as
 * dense are left out of the count, so it is a lower bound. Answers "at least this much?" without
 * ordering the densest part, where the elements are largest.
 */
export function minimumDegreeOrder(n: number, Ap: Int32Array, Ai: Int32Array, flopLimit: number): Int32Array | null {
  const { ptr, idx } = symmetricAdjacency(n, Ap, Ai);
  const nzaat = ptr[n];
  const iwlen = Math.max(nzaat + (nzaat >> 1) + 4 * n + 64, 16);
  const iw = new Int32Array(iwlen);
  iw.set(idx.subarray(0, nzaat));
  const pe = new Int32Array(n);
  const len = new Int32Array(n);
  const elen = new Int32Array(n);
  const nv = new Int32Array(n);
  const degree = new Int32Array(n);
  const w = new Int32Array(n);
  const head = new Int32Array(n + 1).fill(EMPTY);
  const next = new Int32Array(n).fill(EMPTY);
  const last = new Int32Array(n).fill(EMPTY);
  const hashHead = new Int32Array(n).fill(EMPTY);
  const hashNext = new Int32Array(n).fill(EMPTY);
  const pivotStep = new Int32Array(n).fill(EMPTY);
  const isDense = new Uint8Array(n);
  let step = 0;
  let nel = 0;
  let pfree = nzaat;
  let mindeg = 0;
  let lemax = 0;
  let flops = 0;
  const wbig = 0x7fffffff - n - 1;
  let wflg = 2;
  const dense = Math.min(n - 2, Math.max(16, Math.floor(10 * Math.sqrt(n))));

  const clearFlag = (): void => {
    if (wflg < 2 || wflg >= wbig) {
      for (let x = 0; x < n; x++) if (w[x] !== 0) w[x] = 1;
      wflg = 2;
    }
  };
  const removeFromDegreeList = (i: number): void => {
    const ilast = last[i];
    const inext = next[i];
    if (inext !== EMPTY) last[inext] = ilast;
    if (ilast !== EMPTY) next[ilast] = inext;
    else head[degree[i]] = inext;
  };
  const insertInDegreeList = (i: number, deg: number): void => {
    const inext = head[deg];
    if (inext !== EMPTY) last[inext] = i;
    next[i] = inext;
    last[i] = EMPTY;
    head[deg] = i;
  };

  for (let i = 0; i < n; i++) {
    pe[i] = ptr[i];
    len[i] = ptr[i + 1] - ptr[i];
    nv[i] = 1;
    w[i] = 1;
    degree[i] = len[i];
  }
  for (let i = 0; i < n; i++) {
    const deg = degree[i];
    if (deg === 0) {
      // an isolated node is eliminated at once
      elen[i] = flip(1);
      nel++;
      pe[i] = EMPTY;
      w[i] = 0;
      pivotStep[i] = step++;
    } else if (deg > dense) {
      isDense[i] = 1;
      nv[i] = 0;
      elen[i] = EMPTY;
      nel++;
      pe[i] = EMPTY;
    } else {
      insertInDegreeList(i, deg);
    }
  }

  while (nel < n) {
    // pivot: a variable of minimum approximate degree
    let deg = mindeg;
    let me = EMPTY;
    for (; deg < n; deg++) {
      me = head[deg];
      if (me !== EMPTY) break;
    }
    if (me === EMPTY) break;
    mindeg = deg;
    removeFromDegreeList(me);
    pivotStep[me] = step++;
    const elenme = elen[me];
    let nvpiv = nv[me];
    nel += nvpiv;
    nv[me] = -nvpiv;
    let degme = 0;
    let pme1: number;
    let pme2: number;

    if (elenme === 0) {
      // the new element is built in place of me's variable list
      pme1 = pe[me];
      pme2 = pme1 - 1;
      const pend = pme1 + len[me];
      for (let p = pme1; p < pend; p++) {
        const i = iw[p];
        const nvi = nv[i];
        if (nvi > 0) {
          degme += nvi;
          nv[i] = -nvi;
          iw[++pme2] = i;
          removeFromDegreeList(i);
        }
      }
    } else {
      // Lme = (A_me ∪ ⋃_{e ∈ E_me} Le) \ me, built at the free end of iw
      let p = pe[me];
      pme1 = pfree;
      const slenme = len[me] - elenme;
      for (let knt1 = 1; knt1 <= elenme + 1; knt1++) {
        let e: number;
        let pj: number;
        let ln: number;
        if (knt1 > elenme) {
          e = me;
          pj = p;
          ln = slenme;
        } else {
          e = iw[p++];
          pj = pe[e];
          ln = len[e];
        }
        for (let knt2 = 1; knt2 <= ln; knt2++) {
          const i = iw[pj++];
          const nvi = nv[i];
          if (nvi <= 0) continue;
          if (pfree >= iwlen) {
            // compress iw: keep only live lists, then move the partial Lme after them
            pe[me] = p;
            len[me] -= knt1;
            if (len[me] === 0) pe[me] = EMPTY;
            pe[e] = pj;
            len[e] = ln - knt2;
            if (len[e] === 0) pe[e] = EMPTY;
            for (let j = 0; j < n; j++) {
              const pn = pe[j];
              if (pn >= 0) {
                pe[j] = iw[pn];
                iw[pn] = flip(j);
              }
            }
            let psrc = 0;
            let pdst = 0;
            const pend = pme1 - 1;
            while (psrc <= pend) {
              const j = flip(iw[psrc++]);
              if (j >= 0) {
                iw[pdst] = pe[j];
                pe[j] = pdst++;
                const lenj = len[j];
                for (let k = 0; k < lenj - 1; k++) iw[pdst++] = iw[psrc++];
              }
            }
            const p1 = pdst;
            for (let ps = pme1; ps < pfree; ps++) iw[pdst++] = iw[ps];
            pme1 = p1;
            pfree = pdst;
            pj = pe[e];
            p = pe[me];
          }
          degme += nvi;
          nv[i] = -nvi;
          iw[pfree++] = i;
          removeFromDegreeList(i);
        }
        if (e !== me) {
          // element e is absorbed into me
          pe[e] = flip(me);
          w[e] = 0;
        }
      }
      pme2 = pfree - 1;
    }
    degree[me] = degme;
    pe[me] = pme1;
    len[me] = pme2 - pme1 + 1;
    elen[me] = flip(nvpiv + degme);
    clearFlag();

    // w[e] − wflg = |Le \ Lme| for every element e touching Lme
    for (let pme = pme1; pme <= pme2; pme++) {
      const i = iw[pme];
      const eln = elen[i];
      if (eln <= 0) continue;
      const nvi = -nv[i];
      const wnvi = wflg - nvi;
      for (let p = pe[i]; p < pe[i] + eln; p++) {
        const e = iw[p];
        let we = w[e];
        if (we >= wflg) we -= nvi;
        else if (we !== 0) we = degree[e] + wnvi;
        w[e] = we;
      }
    }

    // approximate degrees, element absorption, mass elimination, hashing
    for (let pme = pme1; pme <= pme2; pme++) {
      const i = iw[pme];
      const p1 = pe[i];
      const p2 = p1 + elen[i] - 1;
      let pn = p1;
      let hash = 0;
      let d = 0;
      for (let p = p1; p <= p2; p++) {
        const e = iw[p];
        const we = w[e];
        if (we === 0) continue;
        const dext = we - wflg;
        if (dext > 0) {
          d += dext;
          iw[pn++] = e;
          hash += e;
        } else {
          // aggressive absorption: Le ⊆ Lme
          pe[e] = flip(me);
          w[e] = 0;
        }
      }
      elen[i] = pn - p1 + 1;
      const p3 = pn;
      const p4 = p1 + len[i];
      for (let p = p2 + 1; p < p4; p++) {
        const j = iw[p];
        const nvj = nv[j];
        if (nvj > 0) {
          d += nvj;
          iw[pn++] = j;
          hash += j;
        }
      }
      if (elen[i] === 1 && p3 === pn) {
        // i is adjacent to me only: eliminate it together with me
        pe[i] = flip(me);
        const nvi = -nv[i];
        degme -= nvi;
        nvpiv += nvi;
        nel += nvi;
        nv[i] = 0;
        elen[i] = EMPTY;
      } else {
        degree[i] = Math.min(degree[i], d);
        // me goes first in i's element list
        iw[pn] = iw[p3];
        iw[p3] = iw[p1];
        iw[p1] = me;
        len[i] = pn - p1 + 1;
        const h = hash % n;
        hashNext[i] = hashHead[h];
        hashHead[h] = i;
        last[i] = h;
      }
    }
    degree[me] = degme;
    lemax = Math.max(lemax, degme);
    wflg += lemax;
    clearFlag();

    // supervariable detection: variables with identical lists are merged
    for (let pme = pme1; pme <= pme2; pme++) {
      let i = iw[pme];
      if (nv[i] >= 0) continue;
      const h = last[i];
      i = hashHead[h];
      hashHead[h] = EMPTY;
      while (i !== EMPTY) {
        const ln = len[i];
        const eln = elen[i];
        for (let p = pe[i] + 1; p < pe[i] + ln; p++) w[iw[p]] = wflg;
        let jlast = i;
        let j = hashNext[i];
        while (j !== EMPTY) {
          let same = len[j] === ln && elen[j] === eln;
          for (let p = pe[j] + 1; same && p < pe[j] + ln; p++) if (w[iw[p]] !== wflg) same = false;
          if (same) {
            pe[j] = flip(i);
            nv[i] += nv[j];
            nv[j] = 0;
            elen[j] = EMPTY;
            j = hashNext[j];
            hashNext[jlast] = j;
          } else {
            jlast = j;
            j = hashNext[j];
          }
        }
        wflg++;
        i = hashNext[i];
      }
    }

    // back into the degree lists; Lme keeps principal variables only
    let p = pme1;
    const nleft = n - nel;
    for (let pme = pme1; pme <= pme2; pme++) {
      const i = iw[pme];
      const nvi = -nv[i];
      if (nvi <= 0) continue;
      nv[i] = nvi;
      const d = Math.max(0, Math.min(degree[i] + degme - nvi, nleft - nvi));
      insertInDegreeList(i, d);
      mindeg = Math.min(mindeg, d);
      degree[i] = d;
      iw[p++] = i;
    }
    nv[me] = nvpiv;
    for (let k = degme + 1; k <= degme + nvpiv; k++) flops += k * k;
    if (flops >= flopLimit) return null;
    len[me] = p - pme1;
    if (len[me] === 0) {
      pe[me] = EMPTY;
      w[me] = 0;
    }
    if (elenme !== 0) pfree = p;
  }

  // each variable is ordered with the pivot that eliminated it; dense rows last
  const key = new Int32Array(n);
  for (let i = 0; i < n; i++) {
    if (isDense[i]) {
      key[i] = step;
      continue;
    }
    let r = i;
    while (pivotStep[r] === EMPTY) r = flip(pe[r]);
    key[i] = pivotStep[r];
  }
  return countingSortByKey(key, step + 1);
}

/** Indices 0..n−1 sorted by key (stable). */
function countingSortByKey(key: Int32Array, nkeys: number): Int32Array {
  const n = key.length;
  const start = new Int32Array(nkeys + 1);
  for (let i = 0; i < n; i++) start[key[i] + 1]++;
  for (let k = 0; k < nkeys; k++) start[k + 1] += start[k];
  const perm = new Int32Array(n);
  for (let i = 0; i < n; i++) perm[start[key[i]]++] = i;
  return perm;
}

/** Adjacency lists of the symmetric pattern A + Aᵀ without the diagonal, duplicates removed. */
export function symmetricAdjacency(n: number, Ap: Int32Array, Ai: Int32Array): { ptr: Int32Array; idx: Int32Array } {
  const count = new Int32Array(n + 1);
  for (let j = 0; j < n; j++) {
    for (let p = Ap[j]; p < Ap[j + 1]; p++) {
      const i = Ai[p];
      if (i === j) continue;
      count[i + 1]++;
      count[j + 1]++;
    }
  }
  for (let i = 0; i < n; i++) count[i + 1] += count[i];
  const fill = count.slice(0, n);
  const idx = new Int32Array(count[n]);
  for (let j = 0; j < n; j++) {
    for (let p = Ap[j]; p < Ap[j + 1]; p++) {
      const i = Ai[p];
      if (i === j) continue;
      idx[fill[i]++] = j;
      idx[fill[j]++] = i;
    }
  }
  // remove duplicates in place
  const mark = new Int32Array(n).fill(-1);
  const ptr = new Int32Array(n + 1);
  let q = 0;
  for (let i = 0; i < n; i++) {
    for (let p = count[i]; p < count[i + 1]; p++) {
      const j = idx[p];
      if (mark[j] === i) continue;
      mark[j] = i;
      idx[q++] = j;
    }
    ptr[i + 1] = q;
  }
  return { ptr, idx };
}
