import {describeSmallestLayoutBatches} from './support/layout-smallest-batches.ts'

// 1,000 random upward planar graphs in all: seeds 501..1,000 here, 1..500 in layout-smallest-random.test.ts.
describeSmallestLayoutBatches(500, 500)
