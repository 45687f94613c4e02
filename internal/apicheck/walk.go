package apicheck

import (
	"fmt"
	"go/types"
	"slices"
	"strings"
)

// walker writes the lines of one type-checked package into features.
type walker struct {
	pkg      *types.Package
	features map[string]bool
	err      error
}

// walk adds the lines of every exported package-level identifier.
func (w *walker) walk() error {
	scope := w.pkg.Scope()
	for _, name := range scope.Names() {
		obj := scope.Lookup(name)
		if !obj.Exported() {
			continue
		}
		switch obj := obj.(type) {
		case *types.Const:
			w.emitf("const %s %s", name, w.typeString(obj.Type()))
			short, exact := obj.Val().String(), obj.Val().ExactString()
			if short == exact {
				w.emitf("const %s = %s", name, short)
			} else {
				w.emitf("const %s = %s  // %s", name, short, exact)
			}
		case *types.Var:
			w.emitf("var %s %s", name, w.typeString(obj.Type()))
		case *types.Func:
			w.emitf("func %s%s", name, w.signatureString(obj.Signature()))
		case *types.TypeName:
			w.emitType(obj)
		default:
			w.fail("%s: unexpected object %T", name, obj)
		}
	}
	return w.err
}

// emitType adds the lines of the named type or alias obj.
func (w *walker) emitType(obj *types.TypeName) {
	name := obj.Name()
	if obj.IsAlias() {
		w.emitf("type %s = %s", name, w.typeString(obj.Type()))
		return
	}
	named, ok := obj.Type().(*types.Named)
	if !ok {
		w.fail("type %s: unexpected %T", name, obj.Type())
		return
	}
	if tps := named.TypeParams(); tps != nil {
		var b strings.Builder
		b.WriteString(name)
		w.writeTypeParams(&b, tps, true)
		name = b.String()
	}
	switch u := named.Underlying().(type) {
	case *types.Struct:
		w.emitStruct(name, named, u)
	case *types.Interface:
		w.emitInterface(name, u)
		return // its methods are the interface's lines
	default:
		w.emitf("type %s %s", name, w.typeString(u))
	}

	// The method set of T, then the methods only *T has.
	seen := make(map[string]bool)
	for _, t := range []types.Type{named, types.NewPointer(named)} {
		ms := types.NewMethodSet(t)
		for i := range ms.Len() {
			m := ms.At(i)
			if !m.Obj().Exported() || seen[m.Obj().Name()] {
				continue
			}
			seen[m.Obj().Name()] = true
			w.emitMethod(m)
		}
	}
}

// emitMethod adds the line of the method selection m, written with the
// receiver of the method set it belongs to.
func (w *walker) emitMethod(m *types.Selection) {
	sig := m.Type().(*types.Signature)
	var b strings.Builder
	b.WriteString("method (")
	w.writeType(&b, sig.Recv().Type())
	if rtp := sig.RecvTypeParams(); rtp != nil {
		w.writeTypeParams(&b, rtp, false)
	}
	b.WriteString(") ")
	b.WriteString(m.Obj().Name())
	w.writeSignature(&b, sig)
	w.emitf("%s", b.String())
}

// emitStruct adds the lines of the struct type name: the type, its exported
// fields and embedded fields, and the exported fields promoted through
// unexported embedded fields.
func (w *walker) emitStruct(name string, named *types.Named, st *types.Struct) {
	w.emitf("type %s struct", name)
	for i := range st.NumFields() {
		f := st.Field(i)
		if !f.Exported() {
			continue
		}
		if f.Embedded() {
			w.emitf("type %s struct, embedded %s", name, w.typeString(f.Type()))
		} else {
			w.emitf("type %s struct, %s %s", name, f.Name(), w.typeString(f.Type()))
		}
	}
	for _, f := range w.promoted(named, st) {
		w.emitf("type %s struct, promoted %s %s", name, f.Name(), w.typeString(f.Type()))
	}
}

// promoted returns the exported fields that a selector on a value of type
// named reaches through at least one unexported embedded field: fields a
// user can use that no line of an exported type shows. Fields shadowed by
// a shallower one or ambiguous at their depth are left out, as the
// language leaves them out.
func (w *walker) promoted(named *types.Named, st *types.Struct) []*types.Var {
	var found []*types.Var
	visited := map[*types.Named]bool{named: true}
	// visit collects the exported fields of st if hidden (st is reached
	// through an unexported embedded field), and descends into its
	// embedded fields.
	var visit func(st *types.Struct, hidden bool)
	visit = func(st *types.Struct, hidden bool) {
		for i := range st.NumFields() {
			f := st.Field(i)
			if hidden && f.Exported() {
				found = append(found, f)
			}
			if !f.Embedded() {
				continue
			}
			t := types.Unalias(f.Type())
			if p, ok := t.(*types.Pointer); ok {
				t = types.Unalias(p.Elem())
			}
			n, ok := t.(*types.Named)
			if !ok || visited[n] {
				continue
			}
			visited[n] = true
			if inner, ok := n.Underlying().(*types.Struct); ok {
				visit(inner, hidden || !f.Exported())
			}
		}
	}
	visit(st, false)
	var selectable []*types.Var
	for _, g := range found {
		obj, index, _ := types.LookupFieldOrMethod(named, true, w.pkg, g.Name())
		if obj == g && len(index) > 1 && !slices.Contains(selectable, g) {
			selectable = append(selectable, g)
		}
	}
	return selectable
}

// emitInterface adds the lines of the interface type name: its exported
// methods, its type terms if it is a constraint, and either its complete
// method list or the mark of unexported methods.
func (w *walker) emitInterface(name string, it *types.Interface) {
	var names []string
	sealed := false
	ms := types.NewMethodSet(it)
	for i := range ms.Len() {
		m := ms.At(i).Obj().(*types.Func)
		if !m.Exported() {
			sealed = true
			continue
		}
		names = append(names, m.Name())
		w.emitf("type %s interface, %s%s", name, m.Name(), w.signatureString(m.Signature()))
	}
	for _, terms := range w.typeTerms(it) {
		w.emitf("type %s interface, %s", name, terms)
	}
	if sealed {
		w.emitf("type %s interface, unexported methods", name)
		return
	}
	slices.Sort(names)
	if len(names) == 0 {
		w.emitf("type %s interface {}", name)
		return
	}
	w.emitf("type %s interface { %s }", name, strings.Join(names, ", "))
}

// typeTerms returns the unions embedded in it (directly or through embedded
// interfaces), each written as its terms, sorted.
func (w *walker) typeTerms(it *types.Interface) []string {
	var list []string
	for i := range it.NumEmbeddeds() {
		switch e := types.Unalias(it.EmbeddedType(i)).(type) {
		case *types.Union:
			list = append(list, w.unionString(e))
		case *types.Named:
			if inner, ok := e.Underlying().(*types.Interface); ok {
				list = append(list, w.typeTerms(inner)...)
			} else {
				list = append(list, w.typeString(e))
			}
		case *types.Interface:
			list = append(list, w.typeTerms(e)...)
		default:
			list = append(list, w.typeString(e))
		}
	}
	slices.Sort(list)
	return list
}

func (w *walker) unionString(u *types.Union) string {
	var b strings.Builder
	for i := range u.Len() {
		if i > 0 {
			b.WriteString(" | ")
		}
		t := u.Term(i)
		if t.Tilde() {
			b.WriteByte('~')
		}
		w.writeType(&b, t.Type())
	}
	return b.String()
}

func (w *walker) emitf(format string, args ...any) {
	f := "pkg " + w.pkg.Path() + ", " + fmt.Sprintf(format, args...)
	if strings.Contains(f, "\n") {
		w.fail("line with a newline: %q", f)
		return
	}
	if w.features[f] {
		w.fail("line recorded twice: %s", f)
		return
	}
	w.features[f] = true
}

func (w *walker) fail(format string, args ...any) {
	if w.err == nil {
		w.err = fmt.Errorf("%s: "+format, append([]any{w.pkg.Path()}, args...)...)
	}
}

func (w *walker) typeString(t types.Type) string {
	var b strings.Builder
	w.writeType(&b, t)
	return b.String()
}

func (w *walker) signatureString(sig *types.Signature) string {
	var b strings.Builder
	w.writeSignature(&b, sig)
	return b.String()
}

// writeType writes t without parameter names: types of other packages
// qualified by the package name, aliases resolved, byte and rune as uint8
// and int32, type parameters as $index.
func (w *walker) writeType(b *strings.Builder, t types.Type) {
	switch t := t.(type) {
	case *types.Basic:
		b.WriteString(basicName(t))
	case *types.Array:
		fmt.Fprintf(b, "[%d]", t.Len())
		w.writeType(b, t.Elem())
	case *types.Slice:
		b.WriteString("[]")
		w.writeType(b, t.Elem())
	case *types.Pointer:
		b.WriteByte('*')
		w.writeType(b, t.Elem())
	case *types.Map:
		b.WriteString("map[")
		w.writeType(b, t.Key())
		b.WriteByte(']')
		w.writeType(b, t.Elem())
	case *types.Chan:
		switch t.Dir() {
		case types.SendOnly:
			b.WriteString("chan<- ")
		case types.RecvOnly:
			b.WriteString("<-chan ")
		default:
			b.WriteString("chan ")
		}
		w.writeType(b, t.Elem())
	case *types.Signature:
		b.WriteString("func")
		w.writeSignature(b, t)
	case *types.Struct:
		w.writeStruct(b, t)
	case *types.Interface:
		w.writeInterface(b, t)
	case *types.Union:
		b.WriteString(w.unionString(t))
	case *types.Alias:
		w.writeType(b, types.Unalias(t))
	case *types.Named:
		w.writeNamed(b, t)
	case *types.TypeParam:
		// Names of type parameters are not API: their positions are.
		fmt.Fprintf(b, "$%d", t.Index())
	default:
		w.fail("unexpected type %T: %v", t, t)
	}
}

// basicName returns the name of the basic type t as $GOROOT/api records
// it: byte and rune as uint8 and int32, untyped constants as ideal-kind.
func basicName(t *types.Basic) string {
	switch t.Kind() {
	case types.UnsafePointer:
		return "unsafe.Pointer"
	case types.UntypedBool:
		return "ideal-bool"
	case types.UntypedInt:
		return "ideal-int"
	case types.UntypedRune:
		return "ideal-char" // as in $GOROOT/api/go1.txt
	case types.UntypedFloat:
		return "ideal-float"
	case types.UntypedComplex:
		return "ideal-complex"
	case types.UntypedString:
		return "ideal-string"
	case types.Uint8:
		return "uint8"
	case types.Int32:
		return "int32"
	}
	return t.Name()
}

// writeStruct writes the unnamed struct t with every field, since all of
// them make its identity.
func (w *walker) writeStruct(b *strings.Builder, t *types.Struct) {
	b.WriteString("struct{")
	for i := range t.NumFields() {
		if i > 0 {
			b.WriteByte(';')
		}
		f := t.Field(i)
		b.WriteByte(' ')
		if !f.Embedded() {
			b.WriteString(f.Name())
			b.WriteByte(' ')
		}
		w.writeType(b, f.Type())
		if i == t.NumFields()-1 {
			b.WriteByte(' ')
		}
	}
	b.WriteString("}")
}

// writeInterface writes the interface t: its methods sorted, then its
// type terms; an implicit one (a constraint written as its terms) as the
// terms alone.
func (w *walker) writeInterface(b *strings.Builder, t *types.Interface) {
	if t.IsImplicit() { // a constraint written as its terms: [T ~int | ~float64]
		b.WriteString(strings.Join(w.typeTerms(t), " | "))
		return
	}
	var parts []string
	for i := range t.NumMethods() {
		m := t.Method(i)
		parts = append(parts, m.Name()+w.signatureString(m.Signature()))
	}
	slices.Sort(parts)
	parts = append(parts, w.typeTerms(t)...)
	if len(parts) == 0 {
		b.WriteString("interface{}")
		return
	}
	b.WriteString("interface{ " + strings.Join(parts, "; ") + " }")
}

// writeNamed writes the named type t, qualified by its package's name
// when it is not the package walked, with its type arguments.
func (w *walker) writeNamed(b *strings.Builder, t *types.Named) {
	obj := t.Obj()
	if pkg := obj.Pkg(); pkg != nil && pkg != w.pkg {
		b.WriteString(pkg.Name())
		b.WriteByte('.')
	}
	b.WriteString(obj.Name())
	if targs := t.TypeArgs(); targs.Len() > 0 {
		b.WriteByte('[')
		for i := range targs.Len() {
			if i > 0 {
				b.WriteString(", ")
			}
			w.writeType(b, targs.At(i))
		}
		b.WriteByte(']')
	}
}

func (w *walker) writeSignature(b *strings.Builder, sig *types.Signature) {
	if tps := sig.TypeParams(); tps != nil {
		w.writeTypeParams(b, tps, true)
	}
	w.writeParams(b, sig.Params(), sig.Variadic())
	switch res := sig.Results(); res.Len() {
	case 0:
	case 1:
		b.WriteByte(' ')
		w.writeType(b, res.At(0).Type())
	default:
		b.WriteByte(' ')
		w.writeParams(b, res, false)
	}
}

func (w *walker) writeTypeParams(b *strings.Builder, tps *types.TypeParamList, constraints bool) {
	b.WriteByte('[')
	for i := range tps.Len() {
		if i > 0 {
			b.WriteString(", ")
		}
		tp := tps.At(i)
		w.writeType(b, tp)
		if constraints {
			b.WriteByte(' ')
			w.writeType(b, tp.Constraint())
		}
	}
	b.WriteByte(']')
}

func (w *walker) writeParams(b *strings.Builder, t *types.Tuple, variadic bool) {
	b.WriteByte('(')
	for i := range t.Len() {
		if i > 0 {
			b.WriteString(", ")
		}
		typ := t.At(i).Type()
		if variadic && i == t.Len()-1 {
			if s, ok := typ.(*types.Slice); ok {
				b.WriteString("...")
				typ = s.Elem()
			}
		}
		w.writeType(b, typ)
	}
	b.WriteByte(')')
}
