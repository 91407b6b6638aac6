import { api } from '@/lib/api-client';
import type { EvaluateAnswerDto, EvaluateRequestInput, LeanEvaluateAnswerDto } from '@shared/schemas/evaluate';
import { unpackEvaluation } from '@shared/engine/lean';

/** POST /api/evaluate: the answer comes lean (texts once, rows); the screens work on the full form. */
export async function postEvaluation(request: EvaluateRequestInput): Promise<EvaluateAnswerDto> {
  const { excluded, ...lean } = await api.post<LeanEvaluateAnswerDto>('/evaluate', { ...request, form: 'lean' });
  return { ...unpackEvaluation(lean), excluded };
}
