export { PhotosSection } from './components/photos-section';
export type { PhotosSectionProps } from './components/photos-section';
