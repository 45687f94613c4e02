#!/usr/bin/env bash
# Plants small realistic mistakes (a sign, a factor, an exponent, an
# off-by-one), one at a time, in a temporary copy of the tree and reports
# which ones the package's tests catch. Not run by CI (.ci/run).
#
#   .ci/mutants.sh                       every package in the list below
#   .ci/mutants.sh kinematic screw       only these package directories
#   MUTANT_MATCH=study.go .ci/mutants.sh only the mutants whose line matches
#
# It runs on a temporary copy of the working tree (tracked and untracked
# files, the tests as they stand) and never writes to the tree itself.
# Only the mutated package's own tests run: a mistake in internal/linalg
# that only kinematic's tests would notice counts as not caught.
#
# Each mutant is one line of the list: package directory, file, the exact
# text to replace (its first occurrence) and the replacement, separated by
# " ||| ". Status per mutant:
#   KILLED   a test failed: the mistake is caught
#   LIVED    every test passed: the mistake is not caught
#   NOBUILD  the mutant does not compile (not counted)
#   STALE    the text is no longer in the file (update the list; not counted)
#   TIMEOUT  the tests ran longer than MUTANT_TIMEOUT (counted as caught)
# The score per package is KILLED+TIMEOUT over KILLED+TIMEOUT+LIVED.
set -u
root=$(cd "$(dirname "$0")/.." && pwd)
timeout_s=${MUTANT_TIMEOUT:-300}
work=$(mktemp -d)
trap 'rm -rf "$work"' EXIT
# The tracked and untracked (not ignored) files of the working tree.
if git -C "$root" rev-parse --is-inside-work-tree >/dev/null 2>&1; then
	(cd "$root" && git ls-files -co --exclude-standard -z | xargs -0 tar -cf - 2>/dev/null) | tar -xf - -C "$work"
else
	(cd "$root" && tar -cf - .) | tar -xf - -C "$work"
fi

mutants() {
	cat <<'LIST'
kinematic ||| kinematic/statics.go ||| ql := r3.Sub(q, m.origin) ||| ql := q
kinematic ||| kinematic/model.go ||| p.Force, p.Rate = force, -slope ||| p.Force, p.Rate = force, slope
kinematic ||| kinematic/forcelaw.go ||| k := a.Remanence * b.Remanence / (4 * math.Pi * mu0) ||| k := a.Remanence * b.Remanence / (2 * math.Pi * mu0)
kinematic ||| kinematic/forcelaw.go ||| tau := 3 / math.Sqrt(al*al+be*be) ||| tau := 2 / math.Sqrt(al*al+be*be)
kinematic ||| kinematic/forcelaw.go ||| return f, 2 * df, nil ||| return f, df, nil
kinematic ||| kinematic/forcelaw.go ||| f := k * (15*z*z*z/r7 - 9*z/r5) ||| f := k * (15*z*z*z/r7 - 6*z/r5)
kinematic ||| kinematic/statics.go ||| pij := -r3.Dot(t.At(p.p), p.dir) ||| pij := r3.Dot(t.At(p.p), p.dir)
kinematic ||| kinematic/statics.go ||| slope -= factor * p.rate * pij * pij ||| slope += factor * p.rate * pij * pij
kinematic ||| kinematic/preload.go ||| if (force(c) >= v) == falling { ||| if (force(c) >= v) != falling {
kinematic ||| kinematic/statics.go ||| a <= l.Scale*(1+unloadTol) ||| a < l.Scale*(1-unloadTol)
kinematic ||| kinematic/thermal.go ||| s.R *= 1 + pr.alpha*dt ||| s.R *= 1 - pr.alpha*dt
kinematic ||| kinematic/thermal.go ||| q = r3.Add(newRoot, r3.Scale(1+pr.alpha*dt, r3.Sub(q, root))) ||| q = r3.Add(newRoot, r3.Sub(q, root))
# Equivalent, expected to live: n·(p − root) is zero for every seat type
# (each contact's tangent plane passes through its seat's root).
kinematic ||| kinematic/thermal.go ||| - seatAlpha*r3.Dot(n, r3.Sub(p, root)) ||| + seatAlpha*r3.Dot(n, r3.Sub(p, root))
kinematic ||| kinematic/thermal.go ||| g.r[i] *= 1 + pr.ball.Material.Alpha*dt ||| g.r[i] *= 1 - pr.ball.Material.Alpha*dt
kinematic ||| kinematic/study.go ||| k := int(math.Ceil(q*float64(len(mag)))) - 1 ||| k := int(math.Ceil(q*float64(len(mag))))
kinematic ||| kinematic/study.go ||| k := int(math.Ceil(q*float64(len(mag)))) - 1 ||| k := int(math.Floor(q*float64(len(mag)))) - 1
kinematic ||| kinematic/study.go ||| pick(0.9973) ||| pick(0.997)
kinematic ||| kinematic/study.go ||| s.StdDev = math.Sqrt(m2 / float64(len(x)-1)) ||| s.StdDev = math.Sqrt(m2 / float64(len(x)))
kinematic ||| kinematic/study.go ||| dev[i] = s.lim[i] * (2*rng.Float64() - 1) ||| dev[i] = s.lim[i] * rng.Float64()
kinematic ||| kinematic/study.go ||| dev[i] = s.lim[i] * (2*rng.Float64() - 1) ||| dev[i] = s.lim[i] * (rng.Float64() - 0.5)
kinematic ||| kinematic/budget.go ||| return t.HalfWidth, t.HalfWidth / math.Sqrt(3) ||| return t.HalfWidth, t.HalfWidth / 3
kinematic ||| kinematic/seat.go ||| return math.Abs(math.Sin(2 * h)) ||| return math.Abs(math.Sin(h))
kinematic ||| kinematic/model.go ||| return 1.5 * math.Cbrt(k*k*f) ||| return 2 * math.Cbrt(k*k*f)
kinematic ||| kinematic/equilibrium.go ||| h := 1.5 * k * sd ||| h := 2.5 * k * sd
kinematic ||| kinematic/stability.go ||| centreIndex = 1 / linalg.Norm3(freed.At(l.centre)) ||| centreIndex = 1 / linalg.Norm3(freed.At(l.p))
kinematic ||| kinematic/amplification.go ||| rss += r3.Norm2(d[i]) ||| rss += linalg.Norm3(d[i])
kinematic ||| kinematic/budget.go ||| b.RSS += c.Effect * c.Effect ||| b.RSS += c.Effect
kinematic ||| kinematic/budget.go ||| return 3 * t.Sigma, t.Sigma ||| return 2 * t.Sigma, t.Sigma
kinematic ||| kinematic/thermal.go ||| xg := global(x, a.origin) ||| xg := x
kinematic ||| kinematic/thermal.go ||| th.Base*r3.Dot(n, r3.Sub(root, th.BaseRef)) ||| th.Base*r3.Dot(n, root)
kinematic ||| kinematic/score.go ||| card.PressureRatio = math.Max(card.PressureRatio, math.Cbrt(f0[i]/sc.fall[i])) ||| card.PressureRatio = math.Max(card.PressureRatio, math.Sqrt(f0[i]/sc.fall[i]))
kinematic ||| kinematic/model.go ||| d := math.Cbrt(f / k) ||| d := math.Sqrt(f / k)
kinematic/design ||| kinematic/design/evaluate.go ||| if m.CentreIndex < e.Stability.Contacts[e.Weakest].CentreIndex { ||| if m.CentreIndex > e.Stability.Contacts[e.Weakest].CentreIndex {
kinematic/design ||| kinematic/design/design.go ||| 		return s.P50 ||| 		return s.P95
kinematic/design ||| kinematic/design/design.go ||| var percentileNames = [...]string{P99: "p99", P50: "p50", P95: "p95", P9973: "p99.73"} ||| var percentileNames = [...]string{P99: "p99", P50: "p95", P95: "p50", P9973: "p99.73"}
kinematic/design ||| kinematic/design/evaluate.go ||| 			v.Pass = value >= limit ||| 			v.Pass = value > limit
kinematic/design ||| kinematic/design/evaluate.go ||| if first || c.Force < e.MinForce { ||| if first || c.Force > e.MinForce {
kinematic/design ||| kinematic/design/evaluate.go ||| if first || c.PressureRatio > e.MaxPressureRatio { ||| if first || c.PressureRatio < e.MaxPressureRatio {
kinematic/design ||| kinematic/design/units.go ||| 		v *= u.factor ||| 		v /= u.factor
kinematic/design ||| kinematic/design/units.go ||| if exp+u.pow10 > maxExponent || exp+u.pow10 < -maxExponent { ||| if exp+u.pow10 > maxExponent || exp+u.pow10 < maxExponent {
internal/linalg ||| internal/linalg/lu.go ||| if best == 0 || best <= tiny*colMax[k] { ||| if best == 0 || best <= tiny {
internal/linalg ||| internal/linalg/lu.go ||| if best == 0 || best <= tiny*colMax[k] { ||| if best == 0 {
internal/linalg ||| internal/linalg/lu.go ||| if best == 0 || best <= tiny*colMax[k] { ||| if best == 0 || best <= tiny*tiny*colMax[k] {
internal/linalg ||| internal/linalg/sym6.go ||| if !(d > tiny*big) { ||| if !(d > 0) {
internal/linalg ||| internal/linalg/sym6.go ||| d = math.Sqrt(d) ||| d = math.Sqrt(d + tiny)
internal/linalg ||| internal/linalg/sym3.go ||| if d0*d1*d2 > tiny*tr*tr/4 { ||| if d0*d1*d2 > tiny*tr/4 {
internal/linalg ||| internal/linalg/qr.go ||| alpha := -math.Copysign(math.Sqrt(x2), x0) ||| alpha := math.Copysign(math.Sqrt(x2), x0)
internal/linalg ||| internal/linalg/nearest.go ||| q.s[r*3+r]++ ||| q.s[r*3+r]--
# Expected to live: both branches of Norm3 are accurate; the bound only
# chooses the faster one.
internal/linalg ||| internal/linalg/jacobi.go ||| if s > 0x1p-486 && s < 0x1p+486 { ||| if s > 0x1p-486 && s < 0x1p+46 {
internal/constraint ||| internal/constraint/analyze.go ||| if s > tol*sigma[0] { ||| if s > tol*tol*sigma[0] {
internal/constraint ||| internal/constraint/analyze.go ||| r.NearSingular = sigma[rank-1] < NearSingularRatio*sigma[0] ||| r.NearSingular = sigma[rank-1] < sigma[0]/NearSingularRatio
internal/constraint ||| internal/constraint/frame.go ||| if mhi > maxSpread*mlo { ||| if mhi > maxSpread*maxSpread*mlo {
internal/constraint ||| internal/constraint/frame.go ||| ue = exponent(far) + 1 ||| ue = exponent(far) - 1
internal/constraint ||| internal/constraint/frame.go ||| if f2 < minForce*minForce { ||| if f2 < minForce {
internal/constraint ||| internal/constraint/freed.go ||| if k >= -1022 && k <= 1023 { ||| if k >= -1022 && k < 1023 {
screw ||| screw/screw.go ||| return r3.Dot(t.W, w.M) + r3.Dot(t.V, w.F) ||| return r3.Dot(t.W, w.M) - r3.Dot(t.V, w.F)
screw ||| screw/screw.go ||| return r3.Add(t.V, r3.Cross(t.W, q)) ||| return r3.Add(t.V, r3.Cross(q, t.W))
screw ||| screw/screw.go ||| return Wrench{F: w.F, M: r3.Sub(w.M, r3.Cross(o, w.F))} ||| return Wrench{F: w.F, M: r3.Add(w.M, r3.Cross(o, w.F))}
screw ||| screw/screw.go ||| Pitch:     r3.Dot(d, t.V) / w, ||| Pitch:     r3.Dot(d, t.V) / (w * w),
# Expected to live: at rank 6 Free becomes empty instead of nil, which
# nothing documents.
screw ||| screw/analyze.go ||| if r.Rank < 6 { ||| if r.Rank <= 6 {
hertz ||| hertz/pair.go ||| c.PeakPressure = 3 * F / d1 ||| c.PeakPressure = 2 * F / d1
hertz ||| hertz/pair.go ||| c.Stiffness = 1.5 * F / c.Approach ||| c.Stiffness = F / c.Approach
hertz ||| hertz/pair.go ||| x := 2 * math.Pi * ca * ca * p.sh.kp * p0 / 3 ||| x := 2 * math.Pi * ca * p.sh.kp * p0 / 3
hertz ||| hertz/pair.go ||| F := x * math.Sqrt(x) ||| F := x * x
hertz ||| hertz/pair.go ||| b := a * p.sh.kp ||| b := a / p.sh.kp
hertz ||| hertz/stress.go ||| sx := -((1-2*nu)*kp/(1+kp) + 2*nu) ||| sx := -((1-2*nu)*kp/(1+kp) + nu)
# Expected to live: starting values; the iterations that follow make the
# results independent of them.
hertz ||| hertz/stress.go ||| return c + (z1-c)*math.Exp(-0.7*t) ||| return c + (z1-c)*math.Exp(-0.07*t)
hertz ||| hertz/ellipse.go ||| return x * (2.0/3 - x*x/324) ||| return x * (2.0/3 + x*x/324)
hertz ||| hertz/ellipse.go ||| h10 := s * (1 - s) * (1 - s) ||| h10 := s * (1 - s)
LIST
}

want=" $* "
declare -A killed lived other
printf '%-8s %-20s %s\n' STATUS PACKAGE MUTANT
while IFS= read -r line; do
	[[ -z $line || $line == \#* ]] && continue
	pkg=${line%% ||| *}; rest=${line#* ||| }
	file=${rest%% ||| *}; rest=${rest#* ||| }
	old=${rest%% ||| *}; new=${rest#* ||| }
	if [[ $# -gt 0 && $want != *" $pkg "* ]]; then continue; fi
	if [[ -n ${MUTANT_MATCH:-} && $line != *"$MUTANT_MATCH"* ]]; then continue; fi
	f="$work/$file"
	cp "$f" "$f.orig"
	if ! OLD="$old" NEW="$new" perl -0777 -i -pe 'BEGIN{$o=$ENV{OLD};$n=$ENV{NEW};$c=0} $c = s/\Q$o\E/$n/; END{exit($c?0:1)}' "$f"; then
		status=STALE
	else
		start=$(date +%s)
		out=$(cd "$work" && timeout "$timeout_s" go test -count=1 -failfast "./$pkg/" 2>&1); rc=$?
		if [[ $rc -eq 124 ]]; then status=TIMEOUT
		elif [[ $rc -eq 0 ]]; then status=LIVED
		elif grep -q -e '\[build failed\]' -e '\[setup failed\]' <<<"$out"; then status=NOBUILD
		else status=KILLED
		fi
		status="$status $(( $(date +%s) - start ))s"
	fi
	mv "$f.orig" "$f"
	printf '%-12s %-20s %s: %s -> %s\n' "$status" "$pkg" "$file" "$old" "$new"
	case $status in
	KILLED* | TIMEOUT*) killed[$pkg]=$(( ${killed[$pkg]:-0} + 1 )) ;;
	LIVED*) lived[$pkg]=$(( ${lived[$pkg]:-0} + 1 )) ;;
	*) other[$pkg]=$(( ${other[$pkg]:-0} + 1 )) ;;
	esac
done < <(mutants)
echo
echo "score per package (caught/counted; not counted: NOBUILD or STALE)"
for pkg in $(printf '%s\n' "${!killed[@]}" "${!lived[@]}" "${!other[@]}" | sort -u); do
	k=${killed[$pkg]:-0}; l=${lived[$pkg]:-0}
	printf '  %-20s %d/%d caught, %d not counted\n' "$pkg" "$k" $((k + l)) "${other[$pkg]:-0}"
done
