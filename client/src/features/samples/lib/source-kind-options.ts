import { sourceKindLabels, sourceKinds } from '@keyloom/shared';

export const sourceKindOptions = sourceKinds.map((kind) => ({ value: kind, label: sourceKindLabels[kind] }));
