// Run by the benchmark in its own process: builds an order-6 model (method C,
// exclusion) of the whole Brown text and prints its peak resident memory.
import { joinDocuments, loadBrown } from '../brown';
import { PpmModel, prepareText } from '@keyloom/shared';

const start = performance.now();
const text = prepareText(joinDocuments(loadBrown().documents));
const model = PpmModel.train(text, { order: 6, escape: 'C', exclusion: true });
const seconds = (performance.now() - start) / 1000;
// maxRSS is in kilobytes: the true peak, not a sample.
const peakRssMb = Math.round((process.resourceUsage().maxRSS / 1024) * 10) / 10;
process.stdout.write(
  `${JSON.stringify({ peakRssMb, seconds: Math.round(seconds * 10) / 10, contexts: model.contextCount, chars: text.length })}\n`,
);
