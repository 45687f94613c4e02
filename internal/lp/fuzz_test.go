package lp

import (
	"errors"
	"math"
	"testing"
	"time"

	"github.com/sixfold-dev/sixfold/internal/errs"
	"github.com/sixfold-dev/sixfold/internal/fuzzdata"
)

// fuzzProgram decodes a program of 1 + m%12 rows and 1 + n%24 columns from
// data: c, then b, then A column-major; with small, one byte per number,
// an integer from −3 to 3 (degenerate programs: ties, zero right-hand
// sides, repeated columns); otherwise eight bytes per number, any float64.
func fuzzProgram(mb, nb uint8, small bool, data []byte) (c, a, b []float64, ok bool) {
	m, n := 1+int(mb)%12, 1+int(nb)%24
	total := n + m + m*n
	var vs []float64
	if small {
		if len(data) < total {
			return nil, nil, nil, false
		}
		for _, v := range data[:total] {
			vs = append(vs, float64(int(v%7)-3))
		}
	} else {
		g := fuzzdata.Floats(data, total)
		if len(g) == 0 {
			return nil, nil, nil, false
		}
		vs = g[0]
	}
	return vs[:n], vs[n+m:], vs[n : n+m], true
}

// fuzzEncode is the inverse of fuzzProgram for float64 data.
func fuzzEncode(c, a, b []float64) (mb, nb uint8, data []byte) {
	data = fuzzdata.Append(nil, c...)
	data = fuzzdata.Append(data, b...)
	return uint8(len(b) - 1), uint8(len(c) - 1), fuzzdata.Append(data, a...)
}

// FuzzSolve solves fuzzed programs and checks that Solve returns within
// 10 s (the iteration limit; it never hangs) without panicking, that an
// error is one of those documented (ErrNonFinite exactly when an entry is
// NaN or infinite), that every number returned is finite, that an optimum
// and a Farkas certificate pass their checks (verify, not strict: without
// the duality gap, and with bᵀy of a certificate down to −checkTol, since
// both carry rounding that grows with the condition of the basis), and
// that the optimum
// is not worse than gonum's when gonum finds one: by no more than what
// pricing to tolerance can leave, checkTol·(1 + |y|∞)·|x_gonum|₁ plus
// checkTol times the terms of both objectives, all scaled. Seeds: the
// hand-solved programs, small integer programs, and the fuzz-corpus
// programs of kinematic that fit (testdata/programs).
func FuzzSolve(f *testing.F) {
	for _, rows := range [][][]float64{
		{{2, 3, 1}, {4, 1, 2}, {3, 4, 2}},
		{{0.5, -5.5, -2.5, 9}, {0.5, -1.5, -0.5, 1}, {1, 0, 0, 0}},
	} {
		c, a := withSlacks(rows, make([]float64, len(rows[0])))
		c[0] = -1
		m, n, d := fuzzEncode(c, a, []float64{5, 0, 1})
		f.Add(m, n, false, d)
	}
	f.Add(uint8(2), uint8(5), true, []byte("\x04\x04\x03\x02\x05\x03\x03\x04\x02\x03\x03\x04\x04\x05\x02\x01\x03\x03\x03"))
	f.Add(uint8(5), uint8(11), true, []byte("0123456789abcdefghijklmnopqrstuvwxyzABCDEFGHIJKLMNOPQRSTUVWXYZ0123456789abcdefghijklmnopqrstuvwxyzABCDEFGHIJKLMNOPQRSTUVWXYZ"))
	for _, p := range readPrograms(f) {
		if p.m <= 12 && p.n <= 24 {
			m, n, d := fuzzEncode(p.c, p.a, p.b)
			f.Add(m, n, false, d)
		}
	}
	f.Fuzz(func(t *testing.T, mb, nb uint8, small bool, data []byte) {
		c, a, b, ok := fuzzProgram(mb, nb, small, data)
		if !ok {
			return
		}
		finite := true
		for _, v := range data2(c, a, b) {
			finite = finite && !math.IsNaN(v) && !math.IsInf(v, 0)
		}
		type out struct {
			res Result
			err error
		}
		ch := make(chan out, 1)
		go func() {
			res, err := Solve(c, a, b, nil)
			ch <- out{res, err}
		}()
		var o out
		select {
		case o = <-ch:
		case <-time.After(10 * time.Second):
			t.Fatalf("Solve did not return in 10 s")
		}
		res, err := o.res, o.err
		if !finite {
			if !errors.Is(err, errs.ErrNonFinite) {
				t.Fatalf("non-finite input: %v, want ErrNonFinite", err)
			}
			return
		}
		if err != nil {
			if !errors.Is(err, ErrSingular) && !errors.Is(err, ErrIterationLimit) && !errors.Is(err, errs.ErrRange) {
				t.Fatalf("undocumented error %v", err)
			}
			return
		}
		for _, v := range append(append([]float64{res.Value}, res.X...), res.Y...) {
			if math.IsNaN(v) || math.IsInf(v, 0) {
				t.Fatalf("%v with a non-finite number: %+v", res.Status, res)
			}
		}
		verify(t, "fuzz", c, a, b, res, false)
		if res.Status != Optimal {
			return
		}
		g := gonumSolve(c, a, b, time.Second)
		if !g.done || g.err != nil || g.status != Optimal {
			return
		}
		p := newScaledProgram(c, a, b)
		xo, xg, ys := p.x(res.X), p.x(g.x), p.y(res.Y)
		if p.primalViolation(xg) > checkTol {
			return // gonum's point is not feasible to our tolerance
		}
		var vo, vg, mag, xg1, yMax float64
		for j := range p.n {
			vo += p.c[j] * xo[j]
			vg += p.c[j] * xg[j]
			mag += math.Abs(p.c[j]*xo[j]) + math.Abs(p.c[j]*xg[j])
			xg1 += math.Abs(xg[j])
		}
		for _, v := range ys {
			yMax = max(yMax, math.Abs(v))
		}
		if vo > vg+checkTol*(mag+(1+yMax)*xg1) {
			t.Fatalf("optimum %.15g (scaled), worse than gonum's %.15g", vo, vg)
		}
	})
}

// data2 returns the three slices end to end.
func data2(c, a, b []float64) []float64 {
	return append(append(append([]float64(nil), c...), a...), b...)
}
