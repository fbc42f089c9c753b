import {describeSmallestLayoutBatches} from './support/layout-smallest-batches.ts'

// 1,000 random upward planar graphs in all: seeds 1..500 here, 501..1,000 in layout-smallest-random-more.test.ts.
describeSmallestLayoutBatches(0, 500)
