# Capillary absorption factors: sourced by examples/demo.sh (uses $mudepth, $out and step).
# The Tarnwick Institute, its sample TW-118 and its capillaries are invented for the demonstration.

step "TW-118, the lab's invented cobalt-blue pigment (taken as CoAl2O4, 4.4 g/cm³, packing 0.5) in a 0.5 mm capillary, Mo tube" \
    cylinder --formula CoAl2O4 --density 4.4 --packing 0.5 --source Mo --diameter 0.5 --two-theta 10:150:20

step "The same in the lab's borosilicate capillary with a 10 µm wall: the Paalman & Pings factors" \
    cylinder --formula CoAl2O4 --density 4.4 --packing 0.5 --source Mo --diameter 0.5 \
    --container-material borosilicate-3.3 --wall 10um --two-theta 10:150:20

step "Table-style use: μR = 1 in a wall with μR 0.2 and radius ratio 1.05, at 0°, 90° and 180°" \
    cylinder --mu-r 1 --mu-r-container 0.2 --radius-ratio 1.05 --two-theta 0,90,180

# Whole patterns for the plots (and a CSV to feed a refinement program).
"$mudepth" cylinder --formula CoAl2O4 --density 4.4 --packing 0.5 --source Mo --diameter 0.5 \
    --two-theta 2:150:0.05 --plot "$out/tw118_capillary.svg" --csv > "$out/tw118_capillary.csv"
"$mudepth" cylinder --formula CoAl2O4 --density 4.4 --packing 0.5 --source Mo --diameter 0.5 \
    --container-material borosilicate-3.3 --wall 10um --two-theta 2:150:0.05 \
    --plot "$out/tw118_capillary_with_wall.svg" --csv > "$out/tw118_capillary_with_wall.csv"
echo "Plots: $out/tw118_capillary.svg, $out/tw118_capillary_with_wall.svg"
