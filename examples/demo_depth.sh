# Depth probed: sourced by examples/demo.sh (uses $mudepth, $out and step).
# The Tarnwick Institute and its samples are invented for the demonstration.

step "TW-N7, the lab's invented TiAlN-type nitride coating (taken as Ti0.5Al0.5N, 4.6 g/cm³): depth versus 2θ, Cu tube" \
    depth --formula Ti0.5Al0.5N --density 4.6 --source Cu --two-theta 30:130:20

step "TW-N7 at the nitride's 2θ = 37.4°: depth versus incidence through the critical angle" \
    depth --formula Ti0.5Al0.5N --density 4.6 --source Cu --two-theta 37.4 \
    --incidence 0.1,0.2,0.3,0.4,0.5,1,2,5,10,18.7
# The same on a fine grid: the plot $out/tw_n7_depth_vs_incidence.svg and its CSV.
"$mudepth" depth --formula Ti0.5Al0.5N --density 4.6 --source Cu --two-theta 37.4 \
    --incidence 0.02:6:0.02 --plot "$out/tw_n7_depth_vs_incidence.svg" --csv > "$out/tw_n7_depth_vs_incidence.csv"

step "Which incidence probes a 200 nm 1/e depth in TW-N7?" \
    depth --formula Ti0.5Al0.5N --density 4.6 --source Cu --two-theta 37.4,43.5,63.2 --target-depth 200nm
step "A 1 nm target is shallower than the evanescent wave reaches: reported, with the reachable range" \
    depth --formula Ti0.5Al0.5N --density 4.6 --source Cu --two-theta 37.4 --target-depth 1nm

step "Residual stress on the steel substrate (Fe, Cr tube, α-Fe 211 at 156.4°): side inclination" \
    depth --formula Fe --source Cr --two-theta 156.4 --tilt 0:60:15

step "TW-017 corundum powder (packing 0.55) on a 240 mm Bragg-Brentano goniometer: transparency shift of a thick bed" \
    depth --material corundum --packing 0.55 --source Cu --two-theta 25.6,43.4,57.5,88.99 --goniometer-radius 240mm
step "The same powder in a 0.2 mm deep holder" depth --material corundum --packing 0.55 --source Cu --two-theta 25.6,43.4,57.5,88.99 \
    --goniometer-radius 240mm --thickness 0.2mm
