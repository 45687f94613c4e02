package errs

import (
	"errors"
	"fmt"
	"testing"
)

func TestKindFindsParent(t *testing.T) {
	line := New("line contact", ErrDegenerate)
	err := fmt.Errorf("wrapped: %w", line)
	if !errors.Is(err, line) || !errors.Is(err, ErrDegenerate) {
		t.Fatalf("errors.Is(%v) should find the kind and its parent", err)
	}
	if errors.Is(err, ErrRange) || errors.Is(err, ErrNonFinite) {
		t.Fatalf("errors.Is(%v) finds an unrelated sentinel", err)
	}
	if got, want := line.Error(), "line contact"; got != want {
		t.Fatalf("Error() = %q, want %q", got, want)
	}
}
