package errs

import (
	"errors"
	"math"
	"strings"
	"testing"
)

// TestCheckMu: 3 is the largest coefficient accepted; 15 is refused as
// the percentage 15% = 0.15 (hand arithmetic). NaN, infinities and
// negative values are left to the callers.
func TestCheckMu(t *testing.T) {
	for _, mu := range []float64{0, 0.15, 1, 3, math.Inf(1), math.NaN(), -5} {
		if err := CheckMu(mu); err != nil {
			t.Errorf("CheckMu(%g) = %v, want nil", mu, err)
		}
	}
	err := CheckMu(15)
	if !errors.Is(err, ErrRange) {
		t.Fatalf("CheckMu(15) = %v, want ErrRange", err)
	}
	if want := "out of range: a coefficient of friction of 15: a percentage? (15% is 0.15); at most 3"; err.Error() != want {
		t.Errorf("CheckMu(15) = %q, want %q", err, want)
	}
	if err := CheckMu(3.0000001); !errors.Is(err, ErrRange) {
		t.Errorf("CheckMu(3.0000001) = %v, want ErrRange", err)
	}
}

// TestCheckMuReading: the percentage reading keeps the digits written:
// 3.0001 / 100 = 0.030001 and 3.01 / 100 = 0.0301 (hand arithmetic), not
// the float64 quotient's 0.030001000000000003.
func TestCheckMuReading(t *testing.T) {
	for mu, want := range map[float64]string{3.0001: "(3.0001% is 0.030001)", 3.01: "(3.01% is 0.0301)", 15: "(15% is 0.15)", 250: "(250% is 2.5)"} {
		if err := CheckMu(mu); err == nil || !strings.Contains(err.Error(), want) {
			t.Errorf("CheckMu(%g) = %v, want %q", mu, err, want)
		}
	}
}

// TestCheckMuLow: one wording for the lower bound, ≥ 0 or > 0 as the
// entry allows a frictionless answer; NaN and infinities are not finite.
func TestCheckMuLow(t *testing.T) {
	for _, tc := range []struct {
		mu     float64
		zeroOK bool
		is     error
		want   string
	}{
		{-0.1, true, ErrRange, "out of range: a coefficient of friction must be ≥ 0, got -0.1"},
		{-0.1, false, ErrRange, "out of range: a coefficient of friction must be > 0, got -0.1"},
		{0, false, ErrRange, "out of range: a coefficient of friction must be > 0, got 0"},
		{math.NaN(), true, ErrNonFinite, "a coefficient of friction must be finite and ≥ 0, got NaN"},
		{math.Inf(1), false, ErrNonFinite, "a coefficient of friction must be finite and > 0, got +Inf"},
	} {
		err := CheckMuLow(tc.mu, tc.zeroOK)
		if !errors.Is(err, tc.is) || !strings.Contains(err.Error(), tc.want) {
			t.Errorf("CheckMuLow(%g, %v) = %v, want %q", tc.mu, tc.zeroOK, err, tc.want)
		}
	}
	for _, mu := range []float64{0, 0.15, 3, 15} {
		if err := CheckMuLow(mu, true); err != nil {
			t.Errorf("CheckMuLow(%g, true) = %v, want nil", mu, err)
		}
	}
	if err := CheckMuLow(1e-300, false); err != nil {
		t.Errorf("CheckMuLow(1e-300, false) = %v, want nil", err)
	}
}
