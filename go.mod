module github.com/sixfold-dev/sixfold

go 1.26

require (
	github.com/google/go-cmp v0.7.0
	gonum.org/v1/gonum v0.17.0
)

require golang.org/x/tools v0.30.0 // indirect
