import {describeRandomLayoutBatches} from './support/layout-random-batches.ts'

// 1,000 random upward planar graphs in all: seeds 501..1,000 here, 1..500 in layout-random.test.ts.
describeRandomLayoutBatches(500, 500)
