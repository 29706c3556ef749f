import type { ReactTestInstance } from 'react-test-renderer';

/** Host element name of a node (react-native-svg renders RNSVG* host components in tests). */
export function hostName(node: ReactTestInstance): string {
  return typeof node.type === 'string' ? node.type : '';
}

/** Every string drawn as SVG text under a node (react-native-svg text is not a host Text). */
export function svgTexts(root: ReactTestInstance): string[] {
  return root
    .findAll((node) => hostName(node) === 'RNSVGTSpan' && typeof node.props.content === 'string')
    .map((node) => node.props.content as string);
}
