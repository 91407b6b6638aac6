// The load case in words lives in shared/ so the design record's PDF says exactly what the page says.
export { COMPONENT_LABELS, describeLoadCase, pressureSource, summarizeLoadCase } from '@shared/load-case-text';
