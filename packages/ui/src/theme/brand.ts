import type { BrandVariants } from '@fluentui/react-components';

/**
 * Roundbook's brand ramp: "lamp-lit teal", a deep blue-green chosen to stay readable under
 * cap-lamp and floodlight light and to sit apart from the green / amber / red of trigger levels.
 * 10 is the darkest step, 160 the lightest. Steps 80 and darker carry white text at ≥ 5.9:1.
 */
export const roundbookBrand: BrandVariants = {
  10: '#031516',
  20: '#052124',
  30: '#072d31',
  40: '#09393f',
  50: '#0a464c',
  60: '#0c525a',
  70: '#0e5e67',
  80: '#116f79',
  90: '#137f8b',
  100: '#1694a2',
  110: '#1aacbc',
  120: '#1ec9dc',
  130: '#3ed4e5',
  140: '#81cdd5',
  150: '#afdfe4',
  160: '#ddf1f4',
};
