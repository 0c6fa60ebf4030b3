// A component that re-renders only when one of its props changed (shallow), so a keystroke in one
// field does not re-render the others. preact/compat's memo does the same, but importing compat
// brings its option hooks into the start-up chunk; this is the part of it we use.
import { Component, createElement, type ComponentType, type FunctionComponent } from 'preact';

export function pure<P extends object>(render: FunctionComponent<P>): ComponentType<P> {
  class Pure extends Component<P> {
    override shouldComponentUpdate(next: P): boolean {
      const a = this.props as Record<string, unknown>, b = next as Record<string, unknown>;
      for (const k in a) if (k !== 'children' && a[k] !== b[k]) return true;
      for (const k in b) if (!(k in a)) return true;
      return false;
    }
    override render(props: P) {
      return createElement(render as FunctionComponent<P>, props);
    }
  }
  (Pure as unknown as { displayName: string }).displayName = `pure(${render.name})`;
  return Pure;
}
