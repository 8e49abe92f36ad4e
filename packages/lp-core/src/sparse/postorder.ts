/**
 * Postorder of a forest given by parent pointers (children visited in increasing order):
 * post[k] = the node placed k-th. Renumbering by a postorder keeps the fill of a Cholesky
 * factor unchanged and makes every supernode a run of consecutive columns.
 */
export function postorder(parent: Int32Array): Int32Array {
  const n = parent.length;
  const head = new Int32Array(n).fill(-1);
  const next = new Int32Array(n).fill(-1);
  for (let j = n - 1; j >= 0; j--) {
    const p = parent[j];
    if (p === -1) continue;
    next[j] = head[p];
    head[p] = j;
  }
  const post = new Int32Array(n);
  const stack = new Int32Array(n);
  let k = 0;
  for (let root = 0; root < n; root++) {
    if (parent[root] !== -1) continue;
    let top = 0;
    stack[0] = root;
    while (top >= 0) {
      const p = stack[top];
      const child = head[p];
      if (child === -1) {
        top--;
        post[k++] = p;
      } else {
        head[p] = next[child];
        stack[++top] = child;
      }
    }
  }
  return post;
}
