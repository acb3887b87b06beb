# Flat-plate absorption factors: sourced by examples/demo.sh (uses $mudepth, $out and step).
# The Tarnwick Institute and its sample TW-118 are invented for the demonstration.

step "TW-118 (invented cobalt-blue pigment, CoAl2O4) as a 10 µm layer on a zero-background plate, Cu tube: is it infinitely thick?" \
    plate --formula CoAl2O4 --density 4.4 --packing 0.6 --source Cu --thickness 10um --two-theta 20:140:20

step "The same layer at a fixed incidence of 5°" \
    plate --formula CoAl2O4 --density 4.4 --packing 0.6 --source Cu --thickness 10um --incidence 5 --two-theta 20:140:20

step "TW-118 as a 0.3 mm transmission foil between two 25 µm polyimide windows, Mo tube, beam normal to the plate" \
    plate --formula CoAl2O4 --density 4.4 --packing 0.6 --source Mo --thickness 0.3 --mode transmission-normal \
    --window-material polyimide --window-thickness 25um --two-theta 5:85:10

"$mudepth" plate --formula CoAl2O4 --density 4.4 --packing 0.6 --source Mo --thickness 0.3 --mode transmission-normal \
    --window-material polyimide --window-thickness 25um --two-theta 1:85:0.5 --plot "$out/tw118_plate_transmission.svg" >/dev/null
echo "Plot: $out/tw118_plate_transmission.svg"
