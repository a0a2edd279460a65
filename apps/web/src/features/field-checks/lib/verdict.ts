import type { BadgeTone } from '@/components/ui/badge';
import type { Verdict } from './preview';

export const verdictLabels: Record<Verdict, string> = { pass: 'Pass', attention: 'Needs attention', fail: 'Fail' };
export const verdictTones: Record<Verdict, BadgeTone> = { pass: 'pass', attention: 'attention', fail: 'fail' };
