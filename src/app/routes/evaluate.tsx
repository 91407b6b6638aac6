import { EvaluatePage } from '@/features/evaluate/components/evaluate-page';

export const Component = EvaluatePage;
