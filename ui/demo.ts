/** The demo scenario the page opens on (an invented bench coupon, examples/bench-coupon.json). */
import demo from '../examples/bench-coupon.json' with { type: 'json' };
import { cloneJson, type JsonObject } from './json.ts';

export const demoScenario = (): JsonObject => cloneJson(demo as unknown as JsonObject);
