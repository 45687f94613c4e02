// Package apicheck records the exported API of the module's public packages
// and checks it against the file checked in at testdata/api.txt, the way Go
// records its own API in $GOROOT/api/go1.*.txt and checks it with cmd/api.
// A change to the public API fails `go test ./...` until the file is
// rewritten with
//
//	go test ./internal/apicheck -update
//
// and the change is listed in CHANGELOG.md. Every change to the API is then
// deliberate and visible in review.
//
// # Which packages
//
// Every package of the module that a user can import: every package
// directory that `go list ./...` reports (so testdata, hidden and
// underscore directories and nested modules are already left out), except
// those with a path element internal or examples and the main packages.
// A new public package is picked up without any change here.
//
// # What a line records
//
// One item a line, sorted, in the format of $GOROOT/api/go1.txt:
//
//	pkg <import path>, func Name(<parameter types>) <result types>
//	pkg <import path>, method (T) Name(...) ...       value receiver, or promoted to T
//	pkg <import path>, method (*T) Name(...) ...      in the method set of *T only
//	pkg <import path>, type T <underlying type>       for types other than structs and interfaces
//	pkg <import path>, type T = U                     an alias
//	pkg <import path>, type T struct
//	pkg <import path>, type T struct, Field <type>    every exported field
//	pkg <import path>, type T struct, embedded E      every exported embedded field
//	pkg <import path>, type T struct, promoted F <type>
//	pkg <import path>, type T interface { M, N }      the complete method set
//	pkg <import path>, type T interface, M(...) ...   every exported method
//	pkg <import path>, type T interface, unexported methods
//	pkg <import path>, const C <type>                 and const C = <value>
//	pkg <import path>, var V <type>
//
// Parameter names are left out (they are not API); types of other packages
// are qualified by the package name; byte and rune are written uint8 and
// int32; untyped constants have the types ideal-int, ideal-float, ...; type
// parameters are written $0, $1, ... with their constraints. Method lines
// come from go/types' method sets, so methods promoted through embedded
// fields are listed on the embedding type. A "promoted" field line is an
// exported field reached through an unexported embedded field, which no
// other line would show. A constant whose short value is rounded is
// followed by its exact value after "//". An interface with unexported
// methods (a sealed interface) records its exported methods and "unexported
// methods" instead of its method list, since only this module can
// implement it.
//
// # How
//
// The packages are found with `go list -json ./...`, parsed with go/parser
// and type-checked with go/types; their imports are read from the export
// data of `go list -deps -export` (compiled once into the build cache,
// with -race when the test binary was built with it, so that `go test
// -race ./...` reuses what it has built). Only the Go command is needed.
// The listing is for the platform the test runs on; a public package with
// files excluded by build constraints or with cgo files is reported as an
// error rather than listed for one platform only.
package apicheck
