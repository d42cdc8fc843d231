/**
 * Gauss-Jacobi quadrature for the Beta(a, b) distribution on [0, 1], by the Golub-Welsch method: the nodes are the
 * eigenvalues of the Jacobi matrix of the orthogonal polynomials, the weights the squared first components of its
 * eigenvectors. An N-node rule integrates every polynomial of degree <= 2N - 1 exactly against the Beta density.
 * It copes with a, b < 1, where the density is infinite at an end and plain grids lose accuracy.
 */
export interface QuadratureRule {
  nodes: Float64Array;
  weights: Float64Array;
}

/**
 * Recurrence coefficients of the Jacobi polynomials for weight (1-t)^alpha (1+t)^beta on [-1, 1], with
 * alpha = b - 1 and beta = a - 1, mapped to x = (1 + t) / 2. The k = 0 diagonal and k = 1 off-diagonal use the
 * forms with the common factor cancelled, since the general formula is 0/0 when a + b = 2 or a + b = 1.
 */
function jacobiMatrix(size: number, a: number, b: number): { diagonal: Float64Array; offDiagonal: Float64Array } {
  const alpha = b - 1;
  const beta = a - 1;
  const sum = alpha + beta;
  const diagonal = new Float64Array(size);
  const offDiagonal = new Float64Array(size);
  for (let k = 0; k < size; k++) {
    const t =
      k === 0 ? (beta - alpha) / (sum + 2) : ((beta - alpha) * (beta + alpha)) / ((2 * k + sum) * (2 * k + sum + 2));
    diagonal[k] = (1 + t) / 2;
  }
  for (let k = 1; k < size; k++) {
    const twoKSum = 2 * k + sum;
    const squared =
      k === 1
        ? (4 * (1 + alpha) * (1 + beta)) / ((2 + sum) * (2 + sum) * (3 + sum))
        : (4 * k * (k + alpha) * (k + beta) * (k + sum)) / (twoKSum * twoKSum * (twoKSum + 1) * (twoKSum - 1));
    offDiagonal[k - 1] = Math.sqrt(squared) / 2;
  }
  return { diagonal, offDiagonal };
}

/**
 * Implicit QL with Wilkinson shifts on a symmetric tridiagonal matrix (the classic tql2 scheme), tracking only the
 * first row of the eigenvector matrix. `offDiagonal[i]` couples i and i+1; both arrays are overwritten.
 */
function tridiagonalEigen(diagonal: Float64Array, offDiagonal: Float64Array, firstRow: Float64Array): void {
  const n = diagonal.length;
  for (let l = 0; l < n; l++) {
    let iterations = 0;
    let m: number;
    do {
      for (m = l; m < n - 1; m++) {
        const scale = Math.abs(diagonal[m]) + Math.abs(diagonal[m + 1]);
        if (Math.abs(offDiagonal[m]) <= Number.EPSILON * scale) break;
      }
      if (m === l) break;
      if (++iterations > 200) throw new Error('Gauss-Jacobi eigenvalue iteration did not converge');
      let g = (diagonal[l + 1] - diagonal[l]) / (2 * offDiagonal[l]);
      let r = Math.sqrt(g * g + 1);
      g = diagonal[m] - diagonal[l] + offDiagonal[l] / (g + (g >= 0 ? r : -r));
      let s = 1;
      let c = 1;
      let p = 0;
      let i = m - 1;
      let deflated = false;
      for (; i >= l; i--) {
        const f = s * offDiagonal[i];
        const bb = c * offDiagonal[i];
        r = Math.sqrt(f * f + g * g);
        offDiagonal[i + 1] = r;
        if (r === 0) {
          diagonal[i + 1] -= p;
          offDiagonal[m] = 0;
          deflated = true;
          break;
        }
        s = f / r;
        c = g / r;
        g = diagonal[i + 1] - p;
        r = (diagonal[i] - g) * s + 2 * c * bb;
        p = s * r;
        diagonal[i + 1] = g + p;
        g = c * r - bb;
        const upper = firstRow[i + 1];
        firstRow[i + 1] = s * firstRow[i] + c * upper;
        firstRow[i] = c * firstRow[i] - s * upper;
      }
      if (deflated) continue;
      diagonal[l] -= p;
      offDiagonal[l] = g;
      offDiagonal[m] = 0;
    } while (m !== l);
  }
}

/** N-node Gauss rule for E[g(X)], X ~ Beta(a, b); weights sum to 1 up to rounding. Nodes come back sorted. */
export function betaQuadrature(size: number, a: number, b: number): QuadratureRule {
  if (!Number.isSafeInteger(size) || size < 1) throw new RangeError(`size must be a positive integer (got ${size})`);
  if (!(a > 0) || !(b > 0) || !Number.isFinite(a) || !Number.isFinite(b)) {
    throw new RangeError(`a and b must be finite and > 0 (got a=${a}, b=${b})`);
  }
  const { diagonal, offDiagonal } = jacobiMatrix(size, a, b);
  const firstRow = new Float64Array(size);
  firstRow[0] = 1;
  tridiagonalEigen(diagonal, offDiagonal, firstRow);
  const order = Array.from({ length: size }, (_, i) => i).sort((x, y) => diagonal[x] - diagonal[y]);
  const nodes = new Float64Array(size);
  const weights = new Float64Array(size);
  let weightSum = 0;
  order.forEach((from, to) => {
    nodes[to] = Math.min(1, Math.max(0, diagonal[from]));
    weights[to] = firstRow[from] * firstRow[from];
    weightSum += weights[to];
  });
  for (let j = 0; j < size; j++) weights[j] /= weightSum;
  return { nodes, weights };
}
