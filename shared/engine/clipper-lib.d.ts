// Minimal types for clipper-lib 6.4.2 (Angus Johnson's Clipper, JS port), only what the engine uses.
declare module 'clipper-lib' {
  namespace ClipperLib {
    interface IntPoint {
      X: number;
      Y: number;
    }
    type Path = IntPoint[];
    type Paths = Path[];
    class PolyNode {
      IsHole(): boolean;
      Contour(): Path;
      Childs(): PolyNode[];
      ChildCount(): number;
      Parent(): PolyNode | null;
    }
    class PolyTree extends PolyNode {
      Total(): number;
    }
    const ClipType: { ctIntersection: 0; ctUnion: 1; ctDifference: 2; ctXor: 3 };
    const PolyType: { ptSubject: 0; ptClip: 1 };
    const PolyFillType: { pftEvenOdd: 0; pftNonZero: 1; pftPositive: 2; pftNegative: 3 };
    const JoinType: { jtSquare: 0; jtRound: 1; jtMiter: 2 };
    const EndType: { etOpenSquare: 0; etOpenRound: 1; etOpenButt: 2; etClosedLine: 3; etClosedPolygon: 4 };
    class Clipper {
      constructor(initOptions?: number);
      AddPath(path: Path, polyType: number, closed: boolean): boolean;
      AddPaths(paths: Paths, polyType: number, closed: boolean): boolean;
      Execute(clipType: number, solution: Paths | PolyTree, subjFillType?: number, clipFillType?: number): boolean;
      static Area(poly: Path): number;
      static Orientation(poly: Path): boolean;
      static ReversePath(poly: Path): void;
      static CleanPolygons(polys: Paths, distance?: number): Paths;
      static PolyTreeToPaths(tree: PolyTree): Paths;
    }
    class ClipperOffset {
      constructor(miterLimit?: number, arcTolerance?: number);
      ArcTolerance: number;
      AddPath(path: Path, joinType: number, endType: number): void;
      AddPaths(paths: Paths, joinType: number, endType: number): void;
      Execute(solution: Paths | PolyTree, delta: number): void;
    }
  }
  export default ClipperLib;
}
