package errs

import (
	"errors"
	"math"
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
