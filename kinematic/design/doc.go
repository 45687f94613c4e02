// Package design reads, writes and evaluates design files: a whole
// kinematic coupling in a versioned JSON format of this project's own,
// with the requirements the design must meet, so that a test can assert
// them in one line.
//
//	d, err := design.Read(f)           // or design.Parse(b)
//	ev, err := d.Evaluate(ctx)         // everything package kinematic can say
//	if err := ev.Verdicts().Err(); err != nil {
//		t.Fatal(err)                   // one error naming every failed requirement
//	}
//
// [Read] and [Parse] return a [Design], the Go form of the file with every
// quantity in SI units; [Design.Write] writes its canonical form.
// [Design.Build] checks a design and builds package kinematic's objects
// once into a [Built], whose Coupling, Model, Assembly and Scenario every
// analysis shares; [Built.Evaluate] runs the whole evaluation
// ([Design.Evaluate] builds and evaluates in one call) and
// [Evaluation.Verdicts] compares it with the requirements.
// [Design.WithCoupling] writes a coupling changed by kinematic.Optimize
// back into the design, and [Built.Optimize] runs the optimiser with the
// file's own packaging and settings (see Optimisation).
//
// # The file
//
// A design file is one JSON object of UTF-8 text. Its members, with the
// kind of each quantity (see Units) and its default when left out
// ("required" when it has none):
//
//	format              string, required: "sixfold.design/2" (or "sixfold.design/1", see Versions)
//	units               "si", optional: plain numbers are in SI units (see Units)
//	name, description   strings of UTF-8 text, at most 4096 bytes each, optional
//	balls               array, 1 to 64, required; balls[i] sits in seats[i]
//	  name              letters, digits and "_", starting with a letter; default "A", "B", ... by position
//	  centre            [x, y, z] lengths, required
//	  radius            length > 0, required
//	  canoe             boolean: a canoe ball (centre and radius of its segment's sphere); default false
//	  material          material, required
//	seats               array, one per ball, required
//	  type              "vee", "rods", "flat", "trihedral" or "cone", required
//	  up                direction out of the seat towards the ball; default [0, 0, 1]
//	  material          material, required
//	  half_angle        angle in (0, 90) deg, the lean of each contact normal from the
//	                    plane normal to up; required for every type but "flat"; in
//	                    degrees, a number of at most π/2 ("0.785 deg") is refused as radians
//	  flank_radius      vee: length, 0 (flat flanks, the default) or greater than the ball's radius
//	  rod_radius        rods: length > 0, required
//	  direction         vee, rods: the groove's direction; or instead
//	  azimuth           vee, rods: angle of the groove about up from the reference direction
//	  reference         with azimuth: "radial" (towards the centroid of the balls, the default) or "frame_x"
//	  toward            trihedral (required), cone (optional): direction of the first contact
//	preloads            array, at most 64, default none
//	  name              string, optional
//	  point             [x, y, z] lengths, a point of the line of action; default origin
//	  direction         direction of the force on the moving body; required with a force or rate
//	  force             force ≥ 0; default 0
//	  rate              spring rate, N/m, d(force)/d(displacement along direction); default 0
//	  couple            [x, y, z] moments; default zero
//	  magnet            instead of force and rate: two cuboid magnets, attracting, on the line
//	                    (kinematic.MagnetPair): {"size": [a, b, c] lengths, full edges, c along
//	                    the magnetisation, required; "grade": "N42", "N52", "SmCo" or "Sm2Co17",
//	                    or "remanence": flux density; "second": the base's magnet {"size",
//	                    "grade" or "remanence"}, default the same; "offset": [x, y] lengths
//	                    between the centres, default [0, 0]}
//	  magnet_plate      instead of force and rate: a magnet on a steel plate
//	                    (kinematic.MagnetPlate): {"size", "grade" or "remanence"}
//	  table             instead of force and rate: [[gap, force], ...], lengths and forces,
//	                    gaps increasing, at most 256 (kinematic.ForceTable)
//	  gap               length ≥ 0, the seated gap of magnet, magnet_plate or table (the
//	                    clearance between the pole faces, > 0 for magnets: touching faces
//	                    have no finite stiffness); required with them
//	payload             object, default none (massless)
//	  mass              mass ≥ 0; default 0
//	  centre            [x, y, z] lengths, the centre of mass; default origin
//	  inertia           {"xx", "yy", "zz", "xy", "xz", "yz"} moments of inertia: the entries of
//	                    the tensor about the centre of mass in the global frame (the off-diagonal
//	                    entries are minus the products of inertia ∫xy dm); each default 0
//	cases               array of load cases, at most 256, default none
//	  name              string, unique, required
//	  preload           number ≥ 0, the factor on every preload; default 1
//	  gravity           [x, y, z] accelerations; default zero (write [0, 0, "-1 g"] for z up)
//	  acceleration      [x, y, z] accelerations of the base; default zero
//	  applied           array, at most 64, of {"force": [x, y, z] forces, "point": [x, y, z]
//	                    lengths (default origin), "moment": [x, y, z] moments (default zero)}
//	tolerances          array, at most 10 000, default none
//	  dimension         a dimension as kinematic.Assembly names it ("A.Ball.Radius", "B.Seat.Turn"), required
//	  value             length, or angle for Turn, Tilt, Tilt1, Tilt2 and HalfAngle; ≥ 0, required
//	  distribution      "uniform" (value the half-width, the default) or "normal" (value the standard deviation)
//	point_of_interest   [x, y, z] lengths, on the moving body; default origin
//	point_name          string, the point of interest's name in reports and drawings
//	                    ("mirror vertex"); default "point of interest"
//	axis                direction at the point of interest (an optical axis), optional; not [0, 0, 0]
//	thermal             object, optional: a uniform temperature change
//	  delta_t           temperature difference, required
//	  moving_alpha      expansion coefficient of the moving body; default 0
//	  base_alpha        expansion coefficient of the base; default 0
//	  base_ref          [x, y, z] lengths, where the base is held; default origin (changes only the drift in the frame)
//	friction            object, optional: {"mu": number in [0, 3], required; a larger one is refused as a percentage}
//	monte_carlo         object, optional
//	  samples           whole number in [1, 1e7], required
//	  seed              whole number in [0, 2^64); default 0
//	  exact             boolean: seat every sample exactly; default false (first order)
//	vibration           object, optional: a random vibration test or transport (kinematic.Model.Random;
//	                    see Random vibration); needs the payload's mass and inertia and a load case
//	  spectrum          object, required: the base acceleration's power spectral density
//	    name            string, the test level's name, optional
//	    source          string, where the level comes from (a standard and its table), optional
//	    points          array of 2 to 256 breakpoints in increasing frequency, required:
//	                    {"frequency": frequency > 0, required; "asd": spectral density > 0;
//	                    "slope": dB/octave of the segment from the previous breakpoint to this one,
//	                    used when one of its two ends has no asd, and then not 0 (a flat
//	                    segment repeats the asd; an asd of 0 is no asd)}
//	  case              name of the load case whose static forces and stiffness the response is
//	                    linear about; default the first
//	  damping           {"zeta": number in (0, 1) or an array of six} or {"q": number > 0.5 or six}:
//	                    modal viscous damping, one value or one per mode from the lowest; default
//	                    zeta 0.02 (Q = 25)
//	  duration          time > 0 of the test per axis; default 120 s
//	  axes              array of "x", "y", "z" and "worst" (the direction of the least contact
//	                    margin over the sphere), each once; default ["x", "y", "z"]
//	  sigma             number > 0: the k of the k-σ peaks and of the preload for a margin; default 3
//	cycles              array, optional: named load cycles for the hysteresis of micro-slip at the
//	                    contacts (kinematic.Model.Hysteresis; see Load cycles)
//	  name              string, required, unique
//	  substeps          whole number in [1, 1000]: equal parts of each step; default 1; steps
//	                    times substeps at most 20000
//	  steps             array of 1 to 1000 steps, required, each {"force": [x, y, z] forces,
//	                    "point": [x, y, z] lengths, "moment": [x, y, z] moments}, all optional
//	                    (zero), added to the load case; the last has zero force and moment
//	packaging           object, optional: what the grooves must clear when the optimiser turns them
//	                    (see Optimisation); it does not change the evaluation of the design as written
//	  keep_outs         array, at most 64, default none: obstacles on the base that no groove may point at
//	    name            string, optional (for reports)
//	    at              [x, y, z] lengths, required: the obstacle's position
//	    reach           length ≥ 0: only the grooves of balls nearer than this, measured normal to
//	                    the seat's up, avoid it; default 0, every groove
//	    clearance       angle in [0, 90) deg, required: the least angle between a groove and the line
//	                    from its ball to the obstacle
//	  windows           array, at most one per groove, default none: allowed groove azimuths
//	    ball            the name of a ball whose seat is a vee or rods, required
//	    min, max        angles in [-180, 180] deg, required, min < max < min + 180 deg (a groove is a
//	                    line: 180 deg would allow every direction)
//	    reference       "radial" (the default) or "frame_x": where azimuth 0 lies, as for a seat's azimuth
//	optimize            object, optional: the optimiser's settings (kinematic.Optimize), used only when
//	                    a program asks for an optimisation; every member optional
//	  objective         "min_amplification" (the default: the error at the point of interest per unit
//	                    seat error), "min_drift", "min_compliance", "max_shock_level",
//	                    "max_first_frequency", "max_contact_index" or "max_centre_index"
//	  min_centre_index  number in (0, 1): floor on the weakest Maxwell index at the ball centres;
//	                    default requirements.min_centre_index, else none
//	  min_contact_index number in (0, 1): the same at the contact points; default
//	                    requirements.min_contact_index, else none
//	  max_pressure_ratio  number > 0: ceiling on peak Hertz pressure / allowable; default
//	                    requirements.max_pressure_ratio, else none
//	  max_condition     number ≥ 1: ceiling on the condition number of the contacts; default 10
//	                    (kinematic.DesignCondition)
//	  regions           array, at most one per ball, default none (the balls stay where drawn): where a
//	                    ball may move, in its seat's plane about its drawn centre:
//	                    {"ball": name, "half_width": [length, length]} a box of ± the half-widths along
//	                    the plane's first axis (frame x projected) and its second, or
//	                    {"ball": name, "radius": length > 0} a disc
//	  half_angles       array of 1 to 8 angles in (0, 90) deg: the half-angles every groove may take
//	                    (in degrees, a number of at most π/2 is refused as radians); default: as drawn
//	  seed              whole number in [0, 2^64): the random starts of a search with regions; default 0
//	requirements        object, optional; every requirement is optional, every limit > 0
//	  min_centre_index    number in (0, 1): the weakest Maxwell index at the ball centres
//	                      (min_maxwell_index, its first name, is still read)
//	  min_contact_index   number in (0, 1): the weakest Maxwell index at the contact points
//	  max_pressure_ratio  number: peak Hertz pressure / allowable, any contact, any case
//	  min_contact_force   force: the smallest contact force, any contact, any case; or
//	                      {"limit": force, "gravity_any_orientation": boolean (default false)}
//	  min_shock           {"level": acceleration, "case": name or "cases": cases,
//	                      "gravity_any_orientation": boolean (default false)}: shock in the
//	                      worst direction that every contact survives closed, added to the case
//	  min_frequency       {"limit": frequency, "case": name or "cases": cases}: the first
//	                      natural frequency
//	  max_error           {"worst_case": length, "rss": length, "along_axis": boolean}: the
//	                      first-order error budget of the point of interest (at least one limit)
//	  max_study           {"limit": length, "percentile": "p50", "p95", "p99" (default) or
//	                      "p99.73"}: the Monte Carlo study's radial displacement
//	  max_thermal_drift   length: the exact drift of the point of interest relative to the base over delta_t
//	  seating             {"case": name or "cases": cases}: the body must seat against friction mu
//	  max_tilt            {"worst_case": angle, "rss": angle, "study": angle, "percentile": as
//	                      max_study's (default "p99"), with study only}: the moving body's
//	                      rotation from the tolerances (at least one limit): the first-order
//	                      budget's worst case and RSS, and the Monte Carlo study's percentile
//	  min_stiffness       {"along_axis": spring rate, "across_axis": spring rate, "case": name or
//	                      "cases": cases}: the stiffness at the point of interest along the axis
//	                      and across it (the least over the directions normal to it); needs axis
//	  min_preload_margin  {"factor": number ≥ 1, required; "min_force": force (default 0);
//	                      "cases": cases (default "all")}: the preload as given inside its window
//	                      by the factor (see Preload margin)
//	  max_repeatability   {"worst_case": length, "rss": length, "case": name or "cases": cases}:
//	                      the friction repeatability of the point of interest with mu (at
//	                      least one limit; needs friction with mu > 0)
//	  min_random_margin   number > 0: every contact's margin in the vibration (static force over
//	                      RMS dynamic force, the standard deviations at which it opens) along
//	                      every axis; one verdict per axis (needs vibration)
//	  max_random_displacement  length: the RMS displacement of the point of interest relative
//	                      to the base in the vibration, along every axis; one verdict per axis
//	  max_random_openings number > 0: the expected number of openings of the most exposed
//	                      contact in the test (Rice's down-crossings of zero force over the
//	                      duration), along every axis; one verdict per axis. 0.01 means about a
//	                      1 % chance that a contact opens at all; a margin of 3 σ alone can be
//	                      crossed hundreds of times in a ten-minute test at 1 kHz
//	  max_hysteresis      {"displacement": length, "tilt": angle, "cycle": name (default the
//	                      first), "case": name}: the residual displacement and tilt of the point
//	                      of interest after the cycle (at least one limit; needs cycles and
//	                      friction with mu > 0)
//
// A requirement's "case" names a load case; left out (and "cases" left
// out too), it is the first. "cases" is "all" (every load case) or an
// array of case names, each once; a requirement given cases is checked in
// each, one verdict per case. "case" and "cases" exclude each other.
// The prerequisites of a requirement (a payload with mass for a shock,
// with inertia too for a frequency, tolerances for an error or a tilt,
// monte_carlo for a study, thermal for a drift, friction for seating,
// an allowable pressure on every pair for a pressure ratio, the axis for
// a stiffness, preloads for a preload margin, a case with gravity to
// turn for gravity_any_orientation) are checked when the file is read.
//
// # Verdicts
//
// Each requirement gives one [Verdict] (one per case for a requirement on
// several cases) whose note states its conditions. Their text, as
// [Verdict.String] writes it, for the equilateral test fixture
// (testdata/equilateral.json with one toleranced ball, 20 000 samples,
// and the new requirements set; lines broken here):
//
//	requirements.min_contact_force: 60.37 N, needs at least 50 N (at contact C- in case "seated"
//	  with its gravity of 9.807 m/s^2 (1 g) turned to its worst direction (-0.447, -0.775, 0.447)
//	  (any orientation)): passes
//	requirements.min_shock: 57.28 m/s^2 (5.84 g), needs at least 49.03 m/s^2 (5 g) (contact A+
//	  unloads first, added to case "seated" with its gravity of 9.807 m/s^2 (1 g) turned to its
//	  worst direction (-0.894, 0, 0.447) (any orientation)): passes
//	requirements.min_shock: 67.08 m/s^2 (6.84 g), needs at least 49.03 m/s^2 (5 g) (contact A+
//	  unloads first, added to case "preload only", which has no gravity to turn): passes
//	requirements.min_frequency: 789 Hz, needs at least 700 Hz (under case "preload only"): passes
//	requirements.max_study: 4.67e-07 m (0.467 µm), needs at most 1.2e-06 m (1.2 µm) (radial p99 of
//	  20000 samples): passes
//	requirements.max_thermal_drift: 1.069e-06 m (1.069 µm), needs at most 2e-06 m (2 µm) (at the
//	  point of interest over delta_t 10 K, exact seat of the expanded geometry, relative to the
//	  base): passes
//	requirements.seating: seats up to mu = 0.3155, needs mu = 0.1 (under case "seated"): passes
//	requirements.max_tilt.worst_case: 1.886e-05 rad (18.86 µrad), needs at most 2e-05 rad (20 µrad)
//	  (the moving body's rotation, first-order worst case of the tolerances): passes
//	requirements.max_tilt.study: 1.794e-05 rad (17.94 µrad), needs at most 2e-05 rad (20 µrad) (the
//	  moving body's rotation, p95 of 20000 samples): passes
//	requirements.min_stiffness.across_axis: 5.02e+07 N/m (50.2 N/µm), needs at least 5e+07 N/m
//	  (50 N/µm) (at the point of interest under case "seated", axis (0, 0, 1)): passes
//	requirements.min_preload_margin: 1.414, needs at least 1.5 (the preload as given in its window
//	  ×0.7071 (contact A+ at min_force in case "preload only") to ×16.65 (contact B+ at its
//	  allowable pressure in case "seated"); min_force 50 N, cases "seated", "preload only"): fails
//	requirements.max_repeatability.rss: 1.106e-07 m (0.1106 µm), needs at most 5e-07 m (0.5 µm) (at
//	  the point of interest under case "seated" with mu = 0.1): passes
//
// [Verdicts.Err] names every verdict that fails.
//
// # Gravity in any orientation
//
// An instrument may be tilted or turned over: "gravity_any_orientation":
// true on min_shock or min_contact_force keeps each case's gravity
// magnitude g = |gravity| and turns its direction to the worst on the
// sphere, for each contact on its own. The worst is found in closed form,
// not by trying directions. On an exactly constrained coupling the
// contact forces are linear in the load: with the payload's weight m g u
// (u a unit direction) at its centre of mass c, contact i carries
//
//	fᵢ(u) = f0ᵢ + m g (Tᵢ(c)·u)
//
// where f0ᵢ is its force in the case without gravity and Tᵢ(c) the
// velocity of c under the twist that opens contact i alone at unit rate
// (the same Tᵢ that kinematic.Model.Shock uses: a base acceleration a
// along u_a loads the payload with −m a u_a, the same as gravity along
// −u_a). The least over the sphere is at u = −Tᵢ(c)/|Tᵢ(c)|:
//
//	min_u fᵢ(u) = f0ᵢ − m g |Tᵢ(c)|,
//
// which is kinematic.Model.Shock of the case without gravity at
// magnitude g (kinematic.ShockContact.Least). With a shock of level a
// added, gravity and shock are worst along the same direction, the least
// force is f0ᵢ − m (g + a)|Tᵢ(c)|, and contact i unloads at
// a = f0ᵢ/(m |Tᵢ(c)|) − g: the shock level with gravity turned is
// Model.Shock's level of the case without gravity less g (0 when turned
// gravity alone opens a contact). A case without gravity has nothing to
// turn and keeps its forces; the note says so. A requirement with the flag
// needs at least one of its cases to have gravity.
//
// # Preload margin
//
// kinematic.Model.SizePreload gives the window [MinScale, MaxScale] of a
// common factor on every preload element over the requirement's cases:
// below MinScale a contact's force falls below min_force, above MaxScale
// a contact's peak pressure exceeds its allowable (no upper edge without
// allowables). The margin is min(1/MinScale, MaxScale): the factor by
// which the preload as given may fall or rise and stay in the window; it
// must be at least "factor". The sizing chooses the preload, so the
// cases' own "preload" factors are ignored there. A requirement no preload
// can meet fails with the reason in its note.
//
// A material is one of the keys of the reference table of package hertz
// (hertz.Materials), or an object given inline:
//
//	"steel-52100"        hertz.Steel52100, AISI 52100 bearing steel
//	"steel-440c"         hertz.Steel440C, AISI 440C stainless steel
//	"silicon-nitride"    hertz.SiliconNitride
//	"tungsten-carbide"   hertz.TungstenCarbide
//	"sapphire"           hertz.Sapphire
//	"fused-silica"       hertz.FusedSilica
//	"aluminium-6061-t6"  hertz.Aluminium6061T6
//	"invar-36"           hertz.Invar36
//	"ti-6al-4v"          hertz.Ti6Al4V
//	"steel-d2"           hertz.SteelD2, AISI D2 tool steel at 60 HRC
//	{"name": string, "e": pressure > 0 (required), "nu": number in (-1, 0.5] (required),
//	 "alpha": expansion coefficient (default 0), "allowable": pressure ≥ 0 (default 0: none
//	 on file), "source": string}
//
// The keys are package hertz's (hertz.MaterialByKey), the same names the
// example programs take on their command lines.
//
// # Units
//
// A quantity is a string of a number (written as a JSON number) and a
// unit, with or without a space: "12.7 mm", "0.5 µm", "45 deg", "1.5 kN",
// "5 g". The product signs "·", "⋅" and "*" may stand for the space in a
// compound unit, and "²" for "^2". A bare JSON number for a quantity is an
// error naming its path and the units it most likely meant, because
// nothing in a number says whether 6.35 is millimetres or metres:
//
//	design: balls[0].radius: bad unit: 6.35 has no unit: write "6.35 mm" or "6.35 m", or declare
//	"units": "si" at the top of the file to read plain numbers in SI units (m)
//
// except a plain 0, which is zero in every unit, and except in a file that
// declares once, as a member of its top-level object,
//
//	"units": "si"
//
// in which every plain number for a quantity is in its SI unit (m, rad,
// N, Pa, kg, ...; the first unit of each kind below). "si" is the only
// declaration; quantities with units read the same with or without it.
// Directions (up, direction, toward, axis, a preload's direction) and
// pure numbers (nu, mu, preload factors, ratios, indices, samples, seed)
// are plain numbers always; a direction need not be of unit length, but
// it may not be [0, 0, 0]. The units each kind of quantity accepts:
//
//	length                    m (SI), cm, mm, um, µm, μm, nm
//	angle                     rad (SI), mrad, urad, µrad, μrad, deg, °, arcmin, arcsec
//	force                     N (SI), mN, kN
//	spring rate               N/m (SI), kN/m, N/mm, kN/mm, N/um, N/µm, N/μm
//	moment                    N m (SI), N mm, kN m
//	pressure, modulus         Pa (SI), kPa, MPa, GPa
//	mass                      kg (SI), g, mg
//	moment of inertia         kg m^2 (SI), kg cm^2, kg mm^2, g cm^2, g mm^2
//	acceleration              m/s^2 (SI), mm/s^2, g (standard gravity, 9.80665 m/s^2)
//	temperature difference    K (SI), mK
//	expansion coefficient     1/K (SI), /K, ppm/K (10⁻⁶/K)
//	frequency                 Hz (SI), kHz
//	time                      s (SI), ms, min, h
//	spectral density          g^2/Hz (also g2/Hz, g²/Hz), (m/s^2)^2/Hz
//	slope                     dB/oct, dB/octave
//	flux density              T (SI), mT
//
// A spectral density and a slope are in the units of test specifications
// and of kinematic.Spectrum, g²/Hz and dB/octave, and a plain number for
// them is read in those units; 1 (m/s²)²/Hz is 1/9.80665² g²/Hz.
//
// The prefixes are those of the SI Brochure (9th ed., 2019, Table 7); the
// degree, minute and second of arc are π/180, π/10 800 and π/648 000 rad
// (Table 8); standard gravity is 9.80665 m/s² by the 3rd CGPM (1901). A
// decimal multiple is read exactly: "12.7 mm" gives the float64 nearest to
// 0.0127 m, the same as the plain number 0.0127. Conversion happens on
// reading only; a Design holds SI values and package kinematic sees no
// units.
//
// # Versions
//
// The "format" member names the format's version: "sixfold.design/2"
// ([Format]), which this package writes, or "sixfold.design/1". A reader
// rejects a file of any other version with an error wrapping [ErrVersion]
// before it looks at anything else. Within a version the format only
// grows by optional members whose absence means what it meant before, so
// an old file reads the same in a newer reader; a change that would alter
// the meaning of an existing file, or add a required member, makes a new
// version. An older reader rejects a newer file's new members as unknown
// rather than ignoring them. Both versions describe exactly constrained
// couplings (six independent contacts), the case every analysis here
// needs.
//
// Version 2 differs from version 1 in one rule: a bare number for a
// quantity is refused unless the file declares "units": "si". A version 1
// file reads as it always did, its plain numbers in SI units, exactly as
// the same file would as version 2 with "units": "si"; to move a file to
// version 2, change its format and either add that declaration or give
// its plain numbers units.
//
// # Reading
//
// Unknown members, members given twice, values of the wrong JSON type,
// unknown units and out-of-range values are errors. Every error is an
// [*Error] holding the JSON path of the entry ("seats[2].half_angle",
// "cases[0].applied[1].force[2]"; "" for the file as a whole) and a reason
// wrapping one of the sentinels, for example
//
//	design: seats[2].half_angle: out of range: must be in (0, 90) deg, got 95 deg
//
// Errors that package kinematic finds (coincident balls, a groove along its
// own up, a tolerance naming no dimension) are translated to the file's
// paths; an error about two entries (two balls with one centre, a
// dimension toleranced twice) names the second in [Error.Other]; errors.Is finds kinematic's sentinels (ErrRange, ErrDegenerate,
// ErrNotExact are the same values here). A failure of the thermal
// drift's solve (a ball that cannot reach its expanded seat) is blamed on
// the thermal input that moves the geometry most, with the seat in
// [Error.Other]. Bytes that are not UTF-8 are an error wrapping ErrSyntax
// naming the string that holds them (the JSON decoder would replace them
// silently). The reader reads at most [MaxSize] bytes, at most 150 000
// JSON values nested at most 16 deep, names of at most 64 bytes, a name,
// description, material name or source of at most 4096 bytes, and the
// counts given above, so a hostile file cannot make it allocate without
// limit; the Monte Carlo study's cost grows with samples (at most
// 1e7) and stops when the context of Evaluate is cancelled.
//
// # Writing
//
// [Design.Write] writes the canonical form: format version 2 with the
// declaration "units": "si" and plain SI numbers (each the shortest
// decimal that reads back as the same float64, so the round trip is
// exact), the members in the order above, defaults written out where the
// reader needs them and optional zero members left out. It differs
// textually from a file written by hand, but reading it back gives an
// equal Design. A file edited by hand after Write keeps the declaration,
// so its plain numbers stay SI: give a new entry its unit ("6.35 mm"), or
// remove the declaration to have every bare number refused.
//
// # Evaluation
//
// [Design.Evaluate] checks the design and runs, where the design gives the
// data: constraint and Maxwell stability, error amplification at the point
// of interest, rigid statics of every load case with Hertz stresses
// against the allowables, the worst shock, seating against friction, the
// stiffness, compliance at the point of interest and natural modes, the
// first-order error budget, the Monte Carlo study and the thermal drift.
// It returns an [Evaluation]; [Evaluation.Verdicts] holds one [Verdict]
// per requirement set, and [Verdicts.Err] one error naming every failure.
//
// # Load cycles
//
// A cycle is a sequence of loads added to a load case, each reached from
// the one before along a straight path in load (the first from no added
// load), in substeps equal parts: an operator's push and release, a cable
// pulled and let go, a shock or a thermal load as equivalent loads. The
// evaluation follows the point of interest through the cycle with
// micro-slip at the contacts (kinematic.Model.Hysteresis, whose
// documentation states the model and its limits) for the hysteresis
// requirement's cycle and case, or the first cycle in the first case
// without it, with friction's mu; a contact that opens under the cycle
// is a note and the requirement fails. The verdicts compare the length of
// the residual displacement and of the residual rotation with the limits.
//
// # Random vibration
//
// The vibration section describes a random vibration test (or a
// transport) by its base-acceleration spectrum, damping, time per axis
// and axes. [Built.Evaluate] runs kinematic.Model.Random along each axis
// (kinematic.Model.RandomWorst for "worst") at the point of interest, in
// linear theory about the section's load case, and
// kinematic.Model.RandomPreload for the preload factor that gives every
// contact a margin of sigma; [Evaluation.Random] holds the results, one
// [RandomAxis] per axis with the options that gave it (for
// kinematic.Model.RandomDensity). min_random_margin,
// max_random_displacement and max_random_openings give one verdict per
// axis, their notes naming the contact, the direction, the spectrum's name and grms and the case.
// A case that leaves a contact in tension gives no response; the
// requirements then fail with the reason. The conventions (viscous modal
// damping, absolute acceleration, displacement relative to the base,
// normal contact stiffness only, Rice's openings) are package
// kinematic's; see its documentation, "Random vibration". Like every
// figure here, these are engineering estimates: verify them by test and
// defer to the applicable codes and a qualified engineer.
//
// # Optimisation
//
// Reading and evaluating a design never changes it. [Built.Optimize]
// runs kinematic.Optimize on the built coupling and scenario with the
// options that [Built.OptimizeOptions] takes from the file's packaging
// and optimize members, and returns the optimum with the design that
// holds it ([Design.WithCoupling]: groove directions, ball centres and
// half-angles written in, for every seat type), ready for
// [Design.Write]. A groove's window is the longest arc of azimuths
// inside its own window (every azimuth when it has none) that keeps it
// each keep-out's clearance off the line from its ball to every keep-out
// within reach (kinematic.KeepOutWindows); of two equal arcs, the lower.
//
// # Cautions
//
// The results are engineering estimates from the idealised models of
// package kinematic and package hertz: rigid bodies, frictionless Hertz
// point contacts, small displacements, quasi-static loads. A design that
// passes its requirements here is a candidate, not a proof. Where a result
// bears on safety or on hardware that can be damaged, verify it by test,
// and defer to the applicable codes and to a qualified engineer.
// Reference materials carry typical values, some recalled from handbooks
// (see hertz.Material's Source); use certified data for a final design.
package design
