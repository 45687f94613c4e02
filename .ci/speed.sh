#!/usr/bin/env bash
# Speed targets of sixfold as ratios to gonum's 6×6 SVD measured in the
# same process (issue 19): run from anywhere, not part of .ci/run.
#
#   .ci/speed.sh [count] [benchtime]     (defaults 5 and 1s)
#
# Each benchmark runs count times; the median ns/op of each is divided by
# the median of BenchmarkRef/svd. The load averages before and after are
# printed, since the machines are shared.
set -euo pipefail
cd "$(dirname "$0")/.."
count="${1:-5}"
benchtime="${2:-1s}"
bin="$(mktemp -d)/kinematic.test"
trap 'rm -rf "$(dirname "$bin")"' EXIT
go test -c -o "$bin" ./kinematic

echo "load before: $(cat /proc/loadavg)  ($(nproc) cores)"
out="$("$bin" -test.run '^$' -test.cpu 1 -test.count "$count" -test.benchtime "$benchtime" -test.benchmem \
	-test.bench '^(BenchmarkRef|BenchmarkAnalyzeStability|BenchmarkScore|BenchmarkStudySample|BenchmarkOptimize)$/^(svd|inverse|general|three-vee|socket-vee-flat|all|draw|linear|exact|azimuths)$')"
echo "load after:  $(cat /proc/loadavg)"
echo "$out" | grep -E '^Benchmark' | awk '
{ name = $1; sub(/^Benchmark/, "", name); t[name] = t[name] " " $3; allocs[name] = $(NF-1) }
function median(s,    a, n, i, j, x) {
	n = split(s, a, " ")
	for (i = 2; i <= n; i++) { x = a[i]; for (j = i - 1; j >= 1 && a[j] > x; j--) a[j+1] = a[j]; a[j+1] = x }
	return n % 2 ? a[(n+1)/2] : (a[n/2] + a[n/2+1]) / 2
}
END {
	svd = median(t["Ref/svd"])
	if (svd == "" || svd == 0) { print "no SVD reference measured"; exit 1 }
	printf "%-34s %12s %10s %8s  %s\n", "benchmark (median)", "ns/op", "× SVD", "allocs", "target"
	n = split("Ref/svd Ref/inverse AnalyzeStability/general AnalyzeStability/three-vee AnalyzeStability/socket-vee-flat Score/all StudySample/draw StudySample/linear StudySample/exact Optimize/azimuths", order, " ")
	target["AnalyzeStability/general"] = "<= 0.25"
	target["Score/all"] = "<= 1"
	target["StudySample/exact"] = "<= 0.25"
	target["Optimize/azimuths"] = "<= 1000"
	for (i = 1; i <= n; i++) {
		k = order[i]
		if (!(k in t)) continue
		m = median(t[k])
		printf "%-34s %12.1f %10.3f %8s  %s\n", k, m, m / svd, allocs[k], target[k]
	}
	if (("StudySample/linear" in t) && ("StudySample/draw" in t)) {
		d = median(t["StudySample/linear"]) - median(t["StudySample/draw"])
		printf "%-34s %12.1f %10s %8s  %s\n", "linear sample minus draw", d, "", "", "<= 10 ns"
	}
}'
