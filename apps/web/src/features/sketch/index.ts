export { SketchSection } from './components/sketch-section';
export type { SketchJoint, SketchSectionProps } from './components/sketch-section';
