import type { ComponentProps, ReactNode } from 'react';

// The browser draws SVG itself, so on the web the overlay uses DOM elements instead of react-native-svg.
// The charts (victory-native) load react-native-svg as well, and a library that two lazily loaded chunks
// share goes into the chunk every page loads: drawing the overlay without it keeps the library in the
// charts' chunk alone (about 14 KB gzip less for every page).
// Only what `photo-overlay.tsx` passes is translated: `testID` to `data-testid`, the label to `aria-label`.

type WithTestId<P> = P & { testID?: string };

export function Svg({
  testID,
  accessibilityLabel,
  children,
  ...rest
}: WithTestId<ComponentProps<'svg'>> & { accessibilityLabel?: string; children?: ReactNode }) {
  return (
    <svg data-testid={testID} aria-label={accessibilityLabel} role={accessibilityLabel ? 'img' : undefined} {...rest}>
      {children}
    </svg>
  );
}

export function G({ testID, ...rest }: WithTestId<ComponentProps<'g'>>) {
  return <g data-testid={testID} {...rest} />;
}

export function Circle(props: ComponentProps<'circle'>) {
  return <circle {...props} />;
}

export function Line(props: ComponentProps<'line'>) {
  return <line {...props} />;
}

export function Rect(props: ComponentProps<'rect'>) {
  return <rect {...props} />;
}

export function Text(props: ComponentProps<'text'>) {
  return <text {...props} />;
}

export function Image(props: ComponentProps<'image'>) {
  return <image {...props} />;
}
