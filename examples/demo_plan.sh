# Demo fragment (sourced by examples/demo.sh): the Tarnwick lab plans two of its
# invented powders on its two tubes.
step "TW-041 cobalt ferrite, loosely packed: which capillary, plate and tube?" \
    plan --formula CoFe2O4 --density 5.29 --packing 0.5 --source Cu --plot "$out/tw041_plan.svg"
step "TW-063 invented hydrate on the Mo tube" \
    plan --formula "C14H12N2O3·2H2O" --density 1.38 --packing 0.55 --source Mo
