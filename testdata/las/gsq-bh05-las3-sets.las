~Version
VERS.   3.0 : CWLS LOG ASCII STANDARD - VERSION 3.0
WRAP.   NO : ONE LINE PER DEPTH STEP
DLM .   COMMA : DELIMITING CHARACTER BETWEEN DATA COLUMNS
~Well
STRT .M 60.0 : First index value {F}
STOP .M 61.0 : Last index value {F}
STEP .M 0.5 : Step {F}
NULL . -999.25 : Null value
WELL . GSQ-BH05 : Well name
~Log_Definition
DEPT .M : Depth {F}
GR .GAPI : Gamma ray {F}
LITH . : Lithology as logged {S}
~Log_Data | Log_Definition
60.0,41.5,"MDST, grey"
60.5,-999.25,LMST
61.0,44.8,"MDST, dark grey, ""fissile"""
~Core_Definition
CTOP .M : Core run top {F}
CBOT .M : Core run base {F}
CDAT . : Date drilled {DD/MM/YYYY}
~Core[1] | Core_Definition
58.50,61.50,04/03/2025
~Core[2] | Core_Definition
61.50,64.50,05/03/2025
~Inclinometry_Definition
MD .M : Measured depth {F}
AZIM .DEG : Hole azimuth (true) {F}
INCL .DEG : Inclination from vertical {F}
~Inclinometry_Data | Inclinometry_Definition
0.0,190.0,30.0
30.0,190.5,30.2
60.0,191.0,30.6
~Log_Definition
DEPT .M : Depth {F}
TT .US : Travel time, second run {F}
~Log_Data | Log_Definition
60.0,61.2
60.5,60.8
