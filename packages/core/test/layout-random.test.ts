import {describeRandomLayoutBatches} from './support/layout-random-batches.ts'

// 1,000 random upward planar graphs in all: seeds 1..500 here, 501..1,000 in layout-random-more.test.ts.
describeRandomLayoutBatches(0, 500)
