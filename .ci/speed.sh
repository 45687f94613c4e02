#!/usr/bin/env bash
# Speed targets of sixfold as ratios to gonum's 6×6 SVD measured in the
# same process (issue 19): run from anywhere, not part of .ci/run.
#
#   .ci/speed.sh [rounds] [benchtime]     (defaults 5 and 1s)
#
# Each round runs every benchmark once, in one process, after the SVD
# reference; a benchmark's ratio in a round is its ns/op over that
# round's SVD. Printed per benchmark: the median ns/op, the median of the
# rounds' ratios, and the ratio of the smallest times (the least
# disturbed, on a shared machine). The load averages before and after are
# printed too.
#
# SPEED_BEFORE=dir also builds the benchmarks from another checkout (a
# tree of an earlier commit from git archive, say) and runs the two in
# turn, round by round, so that both meet the same load; it prints a
# table for each.
set -euo pipefail
cd "$(dirname "$0")/.."
rounds="${1:-5}"
benchtime="${2:-1s}"
dir="$(mktemp -d)"
trap 'rm -rf "$dir"' EXIT
trees=(after)
go test -c -o "$dir/after.test" ./kinematic
if [ -n "${SPEED_BEFORE:-}" ]; then
	(cd "$SPEED_BEFORE" && go test -c -o "$dir/before.test" ./kinematic)
	trees=(before after)
fi

echo "load before: $(cat /proc/loadavg)  ($(nproc) cores)"
for r in $(seq "$rounds"); do
	for tree in "${trees[@]}"; do
		"$dir/$tree.test" -test.run '^$' -test.cpu 1 -test.count 1 -test.benchtime "$benchtime" -test.benchmem \
			-test.bench '^(BenchmarkRef|BenchmarkAnalyzeStability|BenchmarkScore|BenchmarkStudySample|BenchmarkOptimize)$/^(svd|inverse|general|three-vee|socket-vee-flat|all|draw|linear|linear-alone|exact|azimuths)$' |
			grep -E '^Benchmark' | sed "s/^/$r /" >>"$dir/$tree.out"
	done
done
echo "load after:  $(cat /proc/loadavg)"
for tree in "${trees[@]}"; do
	[ "${#trees[@]}" -gt 1 ] && echo "== $tree"
	awk '
{ r = $1; name = $2; sub(/^Benchmark/, "", name); ns[r, name] = $4; allocs[name] = $(NF-1); names[name] = 1; R[r] = 1 }
function median(s,    a, n, i, j, x) {
	n = split(s, a, " ")
	for (i = 2; i <= n; i++) { x = a[i]; for (j = i - 1; j >= 1 && a[j] > x; j--) a[j+1] = a[j]; a[j+1] = x }
	return n % 2 ? a[(n+1)/2] : (a[n/2] + a[n/2+1]) / 2
}
function minimum(s,    a, n, i, m) {
	n = split(s, a, " "); m = a[1]
	for (i = 2; i <= n; i++) if (a[i] < m) m = a[i]
	return m
}
END {
	for (k in names) { t[k] = ""; q[k] = "" }
	for (r in R) for (k in names) if ((r, k) in ns) {
		t[k] = t[k] " " ns[r, k]
		if ((r, "Ref/svd") in ns) q[k] = q[k] " " ns[r, k] / ns[r, "Ref/svd"]
	}
	svdmin = minimum(t["Ref/svd"])
	printf "%-34s %12s %12s %12s %7s  %s\n", "benchmark", "median ns", "median ×SVD", "min/min×SVD", "allocs", "target"
	n = split("Ref/svd Ref/inverse AnalyzeStability/general AnalyzeStability/three-vee AnalyzeStability/socket-vee-flat Score/all StudySample/draw StudySample/linear StudySample/linear-alone StudySample/exact Optimize/azimuths", order, " ")
	target["AnalyzeStability/general"] = "<= 0.25"
	target["Score/all"] = "<= 1"
	target["StudySample/exact"] = "<= 0.25"
	target["Optimize/azimuths"] = "<= 1000"
	for (i = 1; i <= n; i++) {
		k = order[i]
		if (!(k in names)) continue
		printf "%-34s %12.1f %12.3f %12.3f %7s  %s\n", k, median(t[k]), median(q[k]), minimum(t[k]) / svdmin, allocs[k], target[k]
	}
	if (("StudySample/linear" in names) && ("StudySample/draw" in names)) {
		printf "%-34s %12.1f %12s %12.1f %7s  %s\n", "linear sample minus draw (ns)", median(t["StudySample/linear"]) - median(t["StudySample/draw"]), "", minimum(t["StudySample/linear"]) - minimum(t["StudySample/draw"]), "", "<= 10 ns"
	}
}' "$dir/$tree.out"
done
