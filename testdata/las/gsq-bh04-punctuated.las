~Version Information ---------------------------------------------------------
 VERS.   2.0 : CWLS log ASCII standard, version 2.0
 WRAP.   NO  : One line per depth step
~Well Information -------------------------------------------------------------
 STRT.M         20.0 : Start depth
 STOP.M         21.0 : Stop depth
 STEP.M          0.5 : Step
 NULL.         -9999 : Null value
 WELL.      GSQ-BH04 : Well name
 COMP. Greyscar Quarry Ltd : Company
 DATE. 2024-03-15 12:30:00 : Date and time logged
 TIME.      12:30:00 : Time
~Curve Information (v2) - resistivity run 1, corrected: borehole fluid (-----------
 DEPT.M             : Depth
 RLLD.OHM-M         : Deep resistivity
 RLLS.OHM-M         : Shallow resistivity
 TENS.KGF           : Cable tension
~Parameter Information - tool settings (run 1) -------------------------------
 RMF .OHM-M    12.5 : Fluid resistivity at surface
~Other Information: remarks
 Logged after flushing; fluid level 4.2 m below collar.
~ASCII Log Data - depth, deep, shallow, tension
 20.0  150.2  140.8  520
 20.5  -9999  139.5  522
 21.0  162.7  151.0  519
