/**
 * Types of @kninnug/constrainautor 4.1.0 for the parts we call. The package ships its TypeScript source as its
 * types, which does not compile under this repo's strict settings (noUncheckedIndexedAccess), so tsconfig maps the
 * import here for the type checker only; bundlers and tsx load the package itself.
 */
declare module '@kninnug/constrainautor' {
  export interface DelaunatorLike {
    coords: ArrayLike<number>;
    triangles: Uint32Array | Uint16Array;
    halfedges: Int32Array;
  }
  export default class Constrainautor {
    constructor(del: DelaunatorLike, edges?: readonly [number, number][]);
    /** Makes the segment between two triangulated points an edge of the mesh; answers its half-edge. */
    constrainOne(segP1: number, segP2: number): number;
    constrainAll(edges: readonly [number, number][]): this;
    delaunify(deep?: boolean): this;
    isConstrained(edge: number): boolean;
  }
}
