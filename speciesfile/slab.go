package speciesfile

// slab hands out values of T from chunks allocated together, so that the
// many small nodes of a syntax tree cost a few large allocations instead of
// one allocation each. A slab belongs to one parse; it is not safe for
// concurrent use.
//
// Chunks grow geometrically from slabMinChunk to slabMaxChunk elements, so a
// small file wastes little and a large file needs about n/slabMaxChunk
// allocations for n nodes. At most one partly used chunk per slab is wasted
// at the end of a parse. A chunk stays reachable while any value handed out
// from it is, which is harmless here because every node of a File is
// reachable from the File anyway.
type slab[T any] struct {
	buf   []T // unused part of the current chunk
	chunk int // size of the next chunk, 0 before the first
}

const (
	slabMinChunk = 4
	slabMaxChunk = 256
)

// refill starts a new chunk able to hold at least n values.
func (s *slab[T]) refill(n int) {
	switch {
	case s.chunk == 0:
		s.chunk = slabMinChunk
	case s.chunk < slabMaxChunk:
		s.chunk *= 2
	}
	s.buf = make([]T, max(s.chunk, n))
}

// new returns a pointer to a zero T.
func (s *slab[T]) new() *T {
	if len(s.buf) == 0 {
		s.refill(1)
	}
	x := &s.buf[0]
	s.buf = s.buf[1:]
	return x
}

// take returns an empty slice with capacity n whose capacity is capped, so
// that an append beyond n reallocates instead of overwriting the next value
// handed out. Requests larger than a full chunk get their own allocation.
func (s *slab[T]) take(n int) []T {
	if n <= 0 {
		return nil
	}
	if n > slabMaxChunk/4 {
		return make([]T, 0, n)
	}
	if len(s.buf) < n {
		s.refill(n)
	}
	x := s.buf[:0:n]
	s.buf = s.buf[n:]
	return x
}
