package kinematic

import (
	"errors"
	"math"
	"testing"

	"gonum.org/v1/gonum/spatial/r3"

	"github.com/sixfold-dev/sixfold/internal/fuzzdata"
	"github.com/sixfold-dev/sixfold/screw"
)

// contactBytes encodes contacts as float64s, seven per contact: point,
// normal, radius; a contact with a radius has its ball centre at
// Point + Radius·Normal.
func contactBytes(cs []Contact) []byte {
	var b []byte
	for _, c := range cs {
		b = fuzzdata.Append(b, c.Point.X, c.Point.Y, c.Point.Z, c.Normal.X, c.Normal.Y, c.Normal.Z, c.Radius)
	}
	return b
}

func bytesContacts(b []byte) []Contact {
	var cs []Contact
	for _, x := range fuzzdata.Floats(b, 7) {
		c := Contact{Point: r3.Vec{X: x[0], Y: x[1], Z: x[2]}, Normal: r3.Vec{X: x[3], Y: x[4], Z: x[5]}, Radius: x[6]}
		c.Centre = r3.Add(c.Point, r3.Scale(c.Radius, c.Normal))
		cs = append(cs, c)
	}
	return cs
}

// FuzzAnalyze checks that Analyze and Stability never panic, and that what
// they return without an error is consistent: DOF = 6 − Rank, Maxwell
// indices in [0, 1], and freed twists with power δᵢⱼ against the contacts
// when the set is not near-singular.
func FuzzAnalyze(f *testing.F) {
	for _, c := range []Coupling{threeVeesF(f), svfF(f)} {
		cs, err := c.Contacts()
		if err != nil {
			f.Fatal(err)
		}
		f.Add(contactBytes(cs))
	}
	f.Add(contactBytes([]Contact{{Point: r3.Vec{X: 1}, Normal: up}, {Point: r3.Vec{Y: 1}, Normal: up}}))
	f.Fuzz(func(t *testing.T, b []byte) {
		cs := bytesContacts(b)
		if len(cs) > 16 {
			return
		}
		an, err := Analyze(cs)
		if err != nil {
			return
		}
		if an.DOF != 6-an.Rank || len(an.Free) != an.DOF || len(an.Participants) != len(an.Redundant) {
			t.Fatalf("DOF %d, rank %d, %d free, %d participants for %d redundancies", an.DOF, an.Rank, len(an.Free), len(an.Participants), len(an.Redundant))
		}
		st, err := an.Stability()
		if err != nil {
			if !errors.Is(err, ErrNotExact) {
				t.Fatalf("stability: %v", err)
			}
			return
		}
		for i, m := range st.Contacts {
			if !(m.Index >= 0 && m.Index <= 1+1e-12) || !(m.CentreIndex >= 0 && m.CentreIndex <= 1+1e-12) {
				t.Fatalf("%d: index %g, centre index %g", i, m.Index, m.CentreIndex)
			}
			if st.Contacts[st.Weakest].Index > m.Index+tieTol {
				t.Fatalf("weakest %d has index %g above %d's %g", st.Weakest, st.Contacts[st.Weakest].Index, i, m.Index)
			}
		}
		if an.NearSingular {
			return
		}
		for i, m := range st.Contacts {
			for j, c := range cs {
				w, err := screw.Line(c.Point, c.Normal)
				if err != nil {
					t.Fatal(err)
				}
				want := 0.0
				if i == j {
					want = 1
				}
				// Power relative to its terms, and to moving the twist
				// from the contacts to the origin (see screw's tests).
				scale := 1 + r3.Norm(m.Freed.W)*(r3.Norm(w.M)+r3.Norm(an.Centre)+an.Length) + r3.Norm(m.Freed.V)
				if p := screw.Power(m.Freed, w); math.Abs(p-want) > 1e-10*an.Condition*scale {
					t.Fatalf("freed %d with contact %d: power %g, want %g (scale %g)", i, j, p, want, scale)
				}
			}
		}
	})
}

func threeVeesF(f *testing.F) Coupling {
	c, err := BisectorVees(isosceles(), three(vee45))
	if err != nil {
		f.Fatal(err)
	}
	return c
}

func svfF(f *testing.F) Coupling {
	c, err := SocketVeeFlat(isosceles(), cube, vee45, flatUp)
	if err != nil {
		f.Fatal(err)
	}
	return c
}
